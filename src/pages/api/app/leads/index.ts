import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { parseInput } from '~/lib/server/http';
import { inquiryListPage, listViewerOf } from '~/lib/server/leads/inquiry-list';
import { canSeeLeads } from '~/lib/server/leads/policy';
import { inquiryListQuerySchema, paramsObject } from '~/lib/shared/inquiry-list';

/** One page of the Inquiries list for a view (filters, search, sort, cursor), with counts per stage. */
export const GET = staffEndpoint({ may: canSeeLeads }, async ({ staff, locals, url }) => {
  const query = parseInput(inquiryListQuerySchema, paramsObject(url.searchParams));
  const viewer = await listViewerOf(locals.em, staff);
  return Response.json(await inquiryListPage(locals.em, viewer, query));
});
