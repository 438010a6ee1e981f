import type { EntityManager } from '@mikro-orm/postgresql';
import { FUNNEL_COLUMNS, type FunnelKey, type FunnelReport, type FunnelWeek } from '~/lib/shared/report-figures';
import type { FunnelStep } from '../embed/funnel-event.entity';
import { weekOf, type ReportPeriod } from './report-period';

const STEP_KEYS: Record<FunnelStep, FunnelKey> = { 'widget-opened': 'opened', 'first-estimate': 'rangeShown', 'lead-sent': 'inquirySent' };

const empty = (): Record<FunnelKey, number> => Object.fromEntries(FUNNEL_COLUMNS.map((c) => [c.key, 0])) as Record<FunnelKey, number>;

/**
 * The price widget's funnel per week. The first three steps are the widget's own counts (one per
 * widget draft and step, by when it happened). The last two follow the inquiries sent that week
 * through the widget: how many of them have a visit on the calendar (booked, done or no one home;
 * cancelled ones are left out) and how many are now at Going ahead. Deleted inquiries are left out.
 */
export async function funnelReport(em: EntityManager, companyId: string, period: ReportPeriod): Promise<FunnelReport> {
  const events = await em.execute<{ week: string; step: FunnelStep; count: number }[]>(
    `select ${weekOf('created_at')} as week, step, count(*)::int as count
         from funnel_event
        where company_id = ? and created_at >= ? and created_at < ?
        group by 1, 2`,
    [period.timeZone, companyId, period.start, period.end],
  );
  const leads = await em.execute<{ week: string; visit_booked: number; going_ahead: number }[]>(
    `select ${weekOf('l.created_at')} as week,
              count(*) filter (where exists (
                select 1 from visit v where v.company_id = l.company_id and v.lead_id = l.id and v.status <> 'cancelled'))::int as visit_booked,
              count(*) filter (where l.stage = 'going-ahead')::int as going_ahead
         from lead l
        where l.company_id = ? and l.source = 'widget' and l.deleted_at is null and l.created_at >= ? and l.created_at < ?
        group by 1`,
    [period.timeZone, companyId, period.start, period.end],
  );
  const byWeek = new Map<string, FunnelWeek>(period.weeks.map((week) => [week, { week, ...empty() }]));
  for (const row of events) {
    const week = byWeek.get(row.week);
    const key = STEP_KEYS[row.step];
    if (week && key) week[key] += row.count;
  }
  for (const row of leads) {
    const week = byWeek.get(row.week);
    if (!week) continue;
    week.visitBooked += row.visit_booked;
    week.goingAhead += row.going_ahead;
  }
  const weeks = [...byWeek.values()];
  const total = empty();
  for (const week of weeks) for (const { key } of FUNNEL_COLUMNS) total[key] += week[key];
  return { weeks, total };
}
