/**
 * Photos nobody will send: uploads under a widget draft whose inquiry never came, and refused or
 * unfinished uploads. Without this their rows and stored files would stay for ever.
 *
 * A photo joins a lead only while its draft's form token is valid (a day, see embed/form-token.ts),
 * and a photo is always younger than its token, so a photo without a lead after 48 hours can no
 * longer be sent. Photos of sent inquiries are the firm's and are never touched here.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { defineJob } from '../jobs/runner';
import * as storage from '../storage/s3';
import { LeadPhoto } from './lead-photo.entity';

/** How long a photo without an inquiry is kept (unsent drafts, refused and unfinished uploads). */
export const ABANDONED_PHOTO_RETENTION_MS = 48 * 60 * 60 * 1000;

/** Rows looked at per round; the job goes on until none is left. */
const BATCH = 200;

/**
 * Removes every photo without a lead older than the retention: its stored files first (upload,
 * image, thumbnail), then its row, so a run cut short leaves rows that the next run finishes.
 * This sweeps all firms at once: a maintenance task, not a request, so no company filter.
 */
export async function removeAbandonedPhotos(em: EntityManager, { now = Date.now() }: { now?: number } = {}): Promise<{ removed: number }> {
  const cutoff = new Date(now - ABANDONED_PHOTO_RETENTION_MS);
  let removed = 0;
  for (;;) {
    const photos = await em.fork().find(LeadPhoto, { lead: null, createdAt: { $lt: cutoff } }, { orderBy: { createdAt: 'asc' }, limit: BATCH });
    for (const photo of photos) {
      for (const key of [photo.uploadKey, photo.imageKey, photo.thumbKey]) if (key) await storage.deleteObject(key);
      // Still without a lead: the row is only deleted if nothing claimed it meanwhile.
      removed += await em.fork().nativeDelete(LeadPhoto, { id: photo.id, lead: null });
    }
    if (photos.length < BATCH) return { removed };
  }
}

export const abandonedPhotosJob = defineJob({
  name: 'photos-remove-abandoned',
  // Hourly, at 17 past: a photo is gone at most an hour after its 48 hours are up.
  schedule: '17 * * * *',
  queue: { policy: 'stately', retryLimit: 2, expireInSeconds: 30 * 60 },
  pollingIntervalSeconds: 30,
  async run(_data, { em }) {
    const { removed } = await removeAbandonedPhotos(em);
    if (removed > 0) console.log(`[jobs] removed ${removed} abandoned photo(s)`);
  },
});
