import type { EntityManager } from '@mikro-orm/postgresql';
import { LEAD_SOURCES, type LeadSource } from '~/lib/shared/labels';
import type { SourceReport } from '~/lib/shared/report-figures';
import { weekOf, type ReportPeriod } from './report-period';

const none = (): Record<LeadSource, number> => Object.fromEntries(LEAD_SOURCES.map((source) => [source, 0])) as Record<LeadSource, number>;

/** Inquiries received per week by where they came from (`Lead.source`); deleted ones left out. */
export async function sourceReport(em: EntityManager, companyId: string, period: ReportPeriod): Promise<SourceReport> {
  const rows = await em.execute<{ week: string; source: LeadSource; count: number }[]>(
    `select ${weekOf('created_at')} as week, source, count(*)::int as count
       from lead
      where company_id = ? and deleted_at is null and created_at >= ? and created_at < ?
      group by 1, 2`,
    [period.timeZone, companyId, period.start, period.end],
  );
  const weeks = period.weeks.map((week) => ({ week, counts: none(), total: 0 }));
  const total = { ...none(), all: 0 };
  for (const row of rows) {
    const week = weeks.find((w) => w.week === row.week);
    if (!week || !(row.source in week.counts)) continue;
    week.counts[row.source] += row.count;
    week.total += row.count;
    total[row.source] += row.count;
    total.all += row.count;
  }
  return { weeks, total };
}
