import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { parseInput, readJson } from '~/lib/server/http';
import { createStaffLead } from '~/lib/server/intake/staff-lead';
import { kickMailDelivery } from '~/lib/server/mail/delivery-job';
import { canEnterLead, canSeeLeads } from '~/lib/server/leads/policy';
import { inquiryListPage, listViewerOf } from '~/lib/server/leads/inquiry-list';
import { inquiryListQuerySchema, paramsObject } from '~/lib/shared/inquiry-list';
import { staffLeadRequestSchema } from '~/lib/shared/intake-schemas';

/** An inquiry taken on the phone, priced like the widget's; 201 with where it lives (200 for a repeated key). */
export const POST = staffEndpoint({ may: canEnterLead }, async ({ staff, locals, request }) => {
  const input = await readJson(request, staffLeadRequestSchema);
  const created = await createStaffLead(locals.em, staff.companyId, input, staff.userId);
  if (!created.repeated) kickMailDelivery();
  const { lead } = created;
  return Response.json(
    { lead: { id: lead.id, reference: lead.reference, url: `/app/leads/${lead.id}`, triageScore: lead.triageScore }, estimate: created.estimate },
    { status: created.repeated ? 200 : 201 },
  );
});

/** One page of the Inquiries list for a view (filters, search, sort, cursor), with counts per stage. */
export const GET = staffEndpoint({ may: canSeeLeads }, async ({ staff, locals, url }) => {
  const query = parseInput(inquiryListQuerySchema, paramsObject(url.searchParams));
  const viewer = await listViewerOf(locals.em, staff);
  return Response.json(await inquiryListPage(locals.em, viewer, query));
});
