/**
 * The owner's Reports, one entry point for the page and the CSV routes: the firm's day, the range
 * read with the shared schema, and each report for that range. Every query is scoped to the firm.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { dayInZone } from '~/lib/shared/time';
import { reportRangeSchema, type ReportName } from '~/lib/shared/report-range';
import type { FinishValueReport, FunnelReport, ResponseReport, SourceReport } from '~/lib/shared/report-figures';
import { Company } from '../companies/company.entity';
import { now } from '../clock';
import { parseInput } from '../http';
import { funnelReport } from './funnel-report';
import { responseReport } from './response-report';
import { finishValueReport } from './finish-value-report';
import { sourceReport } from './source-report';
import { reportPeriod, type ReportPeriod } from './report-period';

export type ReportFigures = {
  funnel: FunnelReport;
  'response-times': ResponseReport;
  'value-by-finish': FinishValueReport;
  sources: SourceReport;
};

const LOADERS: { [N in ReportName]: (em: EntityManager, companyId: string, period: ReportPeriod) => Promise<ReportFigures[N]> } = {
  funnel: funnelReport,
  'response-times': responseReport,
  'value-by-finish': finishValueReport,
  sources: sourceReport,
};

/** Today on the firm's clock, for the default range. */
export async function firmToday(em: EntityManager, companyId: string): Promise<{ today: string; timeZone: string }> {
  const company = await em.findOneOrFail(Company, { id: companyId });
  return { today: dayInZone(now(), company.timeZone), timeZone: company.timeZone };
}

/** The period a request asks for (`from`, `to` as sent); bad input throws InvalidInput with its fields. */
export async function requestedPeriod(em: EntityManager, companyId: string, query: Record<string, string>): Promise<ReportPeriod> {
  const { today, timeZone } = await firmToday(em, companyId);
  return reportPeriod(parseInput(reportRangeSchema(today), query), timeZone);
}

export function loadReport<N extends ReportName>(em: EntityManager, companyId: string, name: N, period: ReportPeriod): Promise<ReportFigures[N]> {
  return LOADERS[name](em, companyId, period);
}
