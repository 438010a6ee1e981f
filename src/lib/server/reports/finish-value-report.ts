import type { EntityManager } from '@mikro-orm/postgresql';
import type { FinishValueReport } from '~/lib/shared/report-figures';
import { estimateSnapshot } from '../estimates/estimate-snapshot';
import { Lead } from '../leads/lead.entity';
import { jobValueCents } from './job-value';
import type { ReportPeriod } from './report-period';

/** The share of a job each of its finishes carries: by covered area, or evenly when nothing is covered. */
export function finishShares(rooms: { treatmentName: string; netSqFt: number }[]): Map<string, number> {
  const shares = new Map<string, number>();
  const area = rooms.reduce((sum, room) => sum + Math.max(0, room.netSqFt), 0);
  for (const room of rooms) {
    const share = area > 0 ? Math.max(0, room.netSqFt) / area : 1 / rooms.length;
    shares.set(room.treatmentName, (shares.get(room.treatmentName) ?? 0) + share);
  }
  return shares;
}

/**
 * The value of the jobs going ahead, by finish (the treatment's name in the firm's Rate book): the
 * inquiries received in the range that are now at Going ahead (deleted ones left out), each worth
 * `jobValueCents`. A job with several finishes is split between them by covered area, and counts
 * as a job of each. Biggest value first; whole cents.
 */
export async function finishValueReport(em: EntityManager, companyId: string, period: ReportPeriod): Promise<FinishValueReport> {
  const leads = await em.find(
    Lead,
    { company: companyId, stage: 'going-ahead', deletedAt: null, createdAt: { $gte: period.start, $lt: period.end } },
    { populate: ['estimate'] },
  );
  const byFinish = new Map<string, { jobs: number; value: number }>();
  let total = 0;
  for (const lead of leads) {
    const value = jobValueCents(lead);
    total += value;
    for (const [finish, share] of finishShares(estimateSnapshot.read(lead.estimate).takeoff.rooms)) {
      const entry = byFinish.get(finish) ?? { jobs: 0, value: 0 };
      entry.jobs += 1;
      entry.value += value * share;
      byFinish.set(finish, entry);
    }
  }
  const finishes = [...byFinish.entries()]
    .map(([finish, { jobs, value }]) => ({ finish, jobs, valueCents: Math.round(value) }))
    .sort((a, b) => b.valueCents - a.valueCents || a.finish.localeCompare(b.finish));
  return { finishes, jobs: leads.length, valueCents: Math.round(total) };
}
