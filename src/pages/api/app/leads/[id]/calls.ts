import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { authorize } from '~/lib/server/auth/guard';
import { readJson } from '~/lib/server/http';
import { canEditLead, canSeeLeads } from '~/lib/server/leads/policy';
import { leadOfCompany } from '~/lib/server/leads/lead.repository';
import { logCall } from '~/lib/server/leads/lead-calls';
import { presentEvent } from '~/lib/server/leads/present-event';
import { callSchema } from '~/lib/shared/inquiry-work-schemas';

/** Logs a call to the homeowner (reached, voicemail, no answer); it counts as contact. Owner and sales. */
export const POST = staffEndpoint({ may: canSeeLeads }, async ({ staff, locals, params, request }) => {
  authorize(staff, canEditLead, await leadOfCompany(locals.em, staff.companyId, params.id ?? ''));
  const input = await readJson(request, callSchema);
  const event = await logCall(locals.em, { companyId: staff.companyId, leadId: params.id!, callerUserId: staff.userId, ...input });
  return Response.json({ event: presentEvent(event) }, { status: 201 });
});
