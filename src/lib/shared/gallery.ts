/** What the gallery island gets from `GET /api/app/leads/ID/photos` (and as its first props). */
export type GalleryPhoto = { id: string; name: string; width: number | null; height: number | null; imageUrl: string; thumbnailUrl: string };
export type GalleryAnswer = { photos: GalleryPhoto[]; expiresAt: string };

/**
 * When to ask for fresh links: a minute before the earliest expires, and never sooner than 5 s
 * from now (a clock a little off must not make it ask in a loop). common practice, no source.
 */
export function refreshDelayMs(expiresAt: string, nowMs: number): number {
  return Math.max(5_000, new Date(expiresAt).getTime() - nowMs - 60_000);
}
