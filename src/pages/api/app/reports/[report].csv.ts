import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { NotFound } from '~/lib/server/errors';
import { firmFormats } from '~/lib/server/rates/firm-formats';
import { reportCsv } from '~/lib/server/reports/report-csv';
import { canSeeReports } from '~/lib/server/reports/policy';
import { loadReport, requestedPeriod } from '~/lib/server/reports/reports';
import { isReportName } from '~/lib/shared/report-range';

/**
 * GET /api/app/reports/NAME.csv?from=YYYY-MM-DD&to=YYYY-MM-DD: one report as a CSV download, for
 * owners (anyone else gets 404). A bad range is a 400 with `fields`, as on the page.
 */
export const GET = staffEndpoint({ may: canSeeReports, hidden: true }, async ({ staff, locals, params, url }) => {
  const name = params.report ?? '';
  if (!isReportName(name)) throw new NotFound('No such report.');
  const period = await requestedPeriod(locals.em, staff.companyId, Object.fromEntries(url.searchParams));
  const [figures, fmt] = [await loadReport(locals.em, staff.companyId, name, period), await firmFormats(locals.em, staff.companyId)];
  return new Response(reportCsv(name, figures, fmt.currency), {
    headers: {
      'content-type': 'text/csv; charset=utf-8',
      'content-disposition': `attachment; filename="${name}-${period.from}-to-${period.to}.csv"`,
    },
  });
});
