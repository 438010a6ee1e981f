import type { LeadPhoto } from './lead-photo.entity';
import { photoLinks } from './lead-photo.service';

/** What the widget learns about a checked photo: its id, size and a short-lived thumbnail link. */
export type WidgetPhoto = { id: string; width: number; height: number; thumbnailUrl: string };

export async function presentWidgetPhoto(photo: LeadPhoto): Promise<WidgetPhoto> {
  const links = await photoLinks(photo);
  if (!links || photo.width === null || photo.height === null) throw new Error(`Photo ${photo.id} is not ready`);
  return { id: photo.id, width: photo.width, height: photo.height, thumbnailUrl: links.thumbnailUrl };
}
