import type { EntityManager } from '@mikro-orm/postgresql';
import type { ResponseFigures, ResponseReport } from '~/lib/shared/report-figures';
import { Company } from '../companies/company.entity';
import { now } from '../clock';
import { responseDueAt, workingMinutesBetween } from '../leads/response-due';
import { percentile } from './percentile';
import { weekOf, type ReportPeriod } from './report-period';

type Row = { week: string; created_at: Date | string; first_contact_at: Date | string | null; response_due_at: Date | string | null };

/** One week's (or the whole range's) figures from its inquiries. */
function figuresOf(rows: { waitedMinutes: number | null; decided: boolean; withinTarget: boolean }[]): ResponseFigures {
  const waits = rows.flatMap((row) => (row.waitedMinutes === null ? [] : [row.waitedMinutes]));
  return {
    received: rows.length,
    answered: waits.length,
    medianMinutes: percentile(waits, 0.5),
    p90Minutes: percentile(waits, 0.9),
    decided: rows.filter((row) => row.decided).length,
    withinTarget: rows.filter((row) => row.withinTarget).length,
  };
}

/**
 * How soon the firm answered, per week of the inquiries received (every source; deleted ones left
 * out). The wait is counted in working time as the Inquiries list counts the response target
 * (Monday–Friday 08:00–17:00 on the firm's clock, `leads/response-due.ts`), from arrival to the
 * first logged call or e-mail. Within target: answered by the inquiry's due time, out of those
 * answered or already past due (an inquiry still inside its target has no verdict yet).
 */
export async function responseReport(em: EntityManager, companyId: string, period: ReportPeriod): Promise<ResponseReport> {
  const company = await em.findOneOrFail(Company, { id: companyId });
  const rows = await em.execute<Row[]>(
    `select ${weekOf('created_at')} as week, created_at, first_contact_at, response_due_at
       from lead
      where company_id = ? and deleted_at is null and created_at >= ? and created_at < ?`,
    [period.timeZone, companyId, period.start, period.end],
  );
  const at = now().getTime();
  const judged = rows.map((row) => {
    const received = new Date(row.created_at);
    const answeredAt = row.first_contact_at === null ? null : new Date(row.first_contact_at);
    // Stored when the inquiry arrived; worked out again only for rows written without it.
    const due = row.response_due_at === null ? responseDueAt(received, period.timeZone, company.responseTargetMinutes) : new Date(row.response_due_at);
    return {
      week: row.week,
      waitedMinutes: answeredAt ? workingMinutesBetween(received, answeredAt, period.timeZone) : null,
      decided: answeredAt !== null || due.getTime() <= at,
      withinTarget: answeredAt !== null && answeredAt.getTime() <= due.getTime(),
    };
  });
  return {
    weeks: period.weeks.map((week) => ({ week, ...figuresOf(judged.filter((row) => row.week === week)) })),
    total: figuresOf(judged),
    targetMinutes: company.responseTargetMinutes,
  };
}
