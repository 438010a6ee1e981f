import type { EntityManager } from '@mikro-orm/postgresql';
import type { GalleryAnswer } from '~/lib/shared/gallery';
import { LINK_EXPIRES_SECONDS, photoLinks, photosOfLead } from './lead-photo.service';

/**
 * The inquiry's ready photos with links signed just now, for the gallery island. `expiresAt` is
 * when the first of them stops working; the island asks again before then. The caller has checked
 * that the viewer may see the lead.
 */
export async function galleryPhotos(em: EntityManager, lead: { companyId: string; leadId: string }, now = Date.now()): Promise<GalleryAnswer> {
  const photos = await photosOfLead(em, lead);
  const signed = await Promise.all(photos.map(async (photo) => ({ photo, links: await photoLinks(photo, now) })));
  return {
    photos: signed.flatMap(({ photo, links }) =>
      links
        ? [{ id: photo.id, name: photo.originalName, width: photo.width, height: photo.height, imageUrl: links.imageUrl, thumbnailUrl: links.thumbnailUrl }]
        : [],
    ),
    expiresAt: new Date(now + LINK_EXPIRES_SECONDS * 1000).toISOString(),
  };
}
