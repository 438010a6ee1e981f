/**
 * Deleted inquiries are kept for the restore window (30 days), then removed for good: their photos'
 * stored files first, then the row (its timeline, photo rows and any inquiry merged into it go with
 * it by the foreign keys). A run cut short leaves rows the next run finishes; files already gone
 * are simply gone.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { defineJob } from '../jobs/runner';
import { Lead } from '../leads/lead.entity';
import { RESTORE_WINDOW_MS } from '../leads/lead-deletion';
import { LeadPhoto } from '../photos/lead-photo.entity';
import * as storage from '../storage/s3';

const BATCH = 100;

/**
 * Purges every inquiry deleted longer ago than the restore window, across all firms (a maintenance
 * task, not a request, so no company filter). An inquiry merged into another is not purged on its
 * own: it is the pointer that keeps its old reference findable, and goes when the kept one goes.
 */
export async function purgeDeletedLeads(em: EntityManager, { now = Date.now() }: { now?: number } = {}): Promise<{ purged: number }> {
  const cutoff = new Date(now - RESTORE_WINDOW_MS);
  let purged = 0;
  for (;;) {
    const leads = await em.fork().find(Lead, { deletedAt: { $lt: cutoff }, mergedInto: null }, { orderBy: { deletedAt: 'asc' }, limit: BATCH, fields: ['id'] });
    for (const lead of leads) {
      const photos = await em.fork().find(LeadPhoto, { lead: lead.id });
      for (const photo of photos) for (const key of [photo.uploadKey, photo.imageKey, photo.thumbKey]) if (key) await storage.deleteObject(key);
      // Still deleted and past the window: a restore meanwhile would have cleared deletedAt.
      purged += await em.fork().nativeDelete(Lead, { id: lead.id, deletedAt: { $lt: cutoff } });
    }
    if (leads.length < BATCH) return { purged };
  }
}

export const purgeDeletedLeadsJob = defineJob({
  name: 'leads-purge-deleted',
  // Hourly, at 41 past: an inquiry is gone at most an hour after its 30 days are up.
  schedule: '41 * * * *',
  queue: { policy: 'stately', retryLimit: 2, expireInSeconds: 30 * 60 },
  pollingIntervalSeconds: 30,
  async run(_data, { em }) {
    const { purged } = await purgeDeletedLeads(em);
    if (purged > 0) console.log(`[jobs] purged ${purged} deleted inquiry(ies)`);
  },
});
