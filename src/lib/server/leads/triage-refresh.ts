/**
 * The one triage reason that changes with time alone is "response so far": an inquiry nobody has
 * contacted loses those points when its response target passes. This job brings the stored score
 * (which the list sorts by) up to date for inquiries whose target passed in the last day; anything
 * that changes a reason otherwise calls `refreshTriageScore` itself.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { defineJob } from '../jobs/runner';
import { ENDED_STAGES } from './duplicates';
import { Lead } from './lead.entity';
import { refreshTriageScore } from './triage';

const WINDOW_MS = 24 * 60 * 60 * 1000;
const BATCH = 200;

/** Re-scores open, uncontacted inquiries whose response target passed within the last day (all firms). */
export async function refreshOverdueTriage(em: EntityManager, { now = new Date() }: { now?: Date } = {}): Promise<{ changed: number }> {
  let changed = 0;
  let after = '00000000-0000-0000-0000-000000000000';
  for (;;) {
    const fork = em.fork();
    const leads = await fork.find(
      Lead,
      {
        id: { $gt: after },
        firstContactAt: null,
        deletedAt: null,
        stage: { $nin: [...ENDED_STAGES] },
        responseDueAt: { $lte: now, $gt: new Date(now.getTime() - WINDOW_MS) },
      },
      { orderBy: { id: 'asc' }, limit: BATCH, populate: ['company', 'estimate'] },
    );
    for (const lead of leads) {
      const before = lead.triageScore;
      if ((await refreshTriageScore(fork, lead, now)).score !== before) changed++;
    }
    await fork.flush();
    if (leads.length < BATCH) return { changed };
    after = leads.at(-1)!.id;
  }
}

export const overdueTriageJob = defineJob({
  name: 'leads-triage-overdue',
  schedule: '*/10 * * * *',
  queue: { policy: 'stately', retryLimit: 2, expireInSeconds: 10 * 60 },
  pollingIntervalSeconds: 30,
  async run(_data, { em }) {
    await refreshOverdueTriage(em);
  },
});
