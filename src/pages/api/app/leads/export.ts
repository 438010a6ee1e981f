import { stringify } from 'csv-stringify/sync';
import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { parseInput } from '~/lib/server/http';
import { currentLog } from '~/lib/server/log';
import { guardCell } from '~/lib/server/leads/csv-guard';
import { allInquiries, listViewerOf } from '~/lib/server/leads/inquiry-list';
import { canExportLeads } from '~/lib/server/leads/policy';
import { firmFormats } from '~/lib/server/rates/firm-formats';
import { inquiryListQuerySchema, paramsObject, type InquiryRow } from '~/lib/shared/inquiry-list';
import { stageLabel } from '~/lib/shared/labels';
import type { Formats } from '~/lib/shared/formats';

const HEADINGS = [
  'Reference',
  'Homeowner',
  'Phone',
  'Postcode',
  'Finish',
  'Covered area',
  'Range from',
  'Range to',
  'Stage',
  'Assigned to',
  'Received',
  'Waiting since',
  'Next follow-up',
  'Triage score',
  'Overdue',
];

function cells(row: InquiryRow, fmt: Formats): string[] {
  return [
    row.reference,
    row.name,
    row.phone,
    row.place,
    row.finish,
    fmt.area(row.areaSqFt),
    fmt.money(row.rangeLowCents, { wholeUnits: true }),
    fmt.money(row.rangeHighCents, { wholeUnits: true }),
    stageLabel(row.stage),
    row.assigneeName ?? '',
    fmt.isoDate(row.receivedAt),
    fmt.isoDate(row.waitingSince),
    row.nextFollowUpAt ? fmt.isoDate(row.nextFollowUpAt) : '',
    String(row.triageScore),
    row.overdue ? 'yes' : 'no',
  ].map(guardCell);
}

/**
 * The list's current view (filters, search, sort; paging ignored) as CSV, for owners. Read and
 * written a batch at a time, so a firm's whole history never sits in memory at once.
 */
export const GET = staffEndpoint({ may: canExportLeads }, async ({ staff, locals, url }) => {
  const params = paramsObject(url.searchParams);
  delete params.after;
  delete params.limit;
  const query = parseInput(inquiryListQuerySchema, params);
  const em = locals.em;
  const [viewer, fmt] = await Promise.all([listViewerOf(em, staff), firmFormats(em, staff.companyId)]);
  const batches = allInquiries(em, viewer, query);
  const encoder = new TextEncoder();
  let headed = false;
  const body = new ReadableStream<Uint8Array>({
    async pull(controller) {
      try {
        if (!headed) {
          headed = true;
          controller.enqueue(encoder.encode(stringify([HEADINGS])));
          return;
        }
        const next = await batches.next();
        if (next.done) return controller.close();
        controller.enqueue(encoder.encode(stringify(next.value.map((row) => cells(row, fmt)))));
      } catch (error) {
        // Headers are gone by now: the download ends short, and the log says why.
        currentLog().error({ err: error }, 'inquiry export failed');
        controller.error(error);
      }
    },
    async cancel() {
      await batches.return(undefined);
    },
  });
  const day = fmt.isoDate(new Date()).slice(0, 10);
  return new Response(body, {
    headers: { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': `attachment; filename="inquiries-${day}.csv"` },
  });
});
