import { authorize } from '~/lib/server/auth/guard';
import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { readJson } from '~/lib/server/http';
import { mergeLeads } from '~/lib/server/intake/merge-leads';
import { leadOfCompany } from '~/lib/server/leads/lead.repository';
import { canEditLead, canSeeLeads } from '~/lib/server/leads/policy';
import { mergeRequestSchema } from '~/lib/shared/intake-schemas';

/** Merges this inquiry into `into` (the one that stays), keeping both histories there. */
export const POST = staffEndpoint({ may: canSeeLeads }, async ({ staff, locals, params, request }) => {
  // The inquiry in the address first: another firm's id is not found before the body is read.
  const lead = await leadOfCompany(locals.em, staff.companyId, params.id ?? '');
  authorize(staff, canEditLead, lead);
  const { into } = await readJson(request, mergeRequestSchema);
  const kept = await mergeLeads(locals.em, {
    companyId: staff.companyId,
    leadId: lead.id,
    intoId: into,
    actorUserId: staff.userId,
    authorize: (one) => authorize(staff, canEditLead, one),
  });
  const url = `/app/leads/${kept.id}`;
  return Response.json({ kept: { id: kept.id, reference: kept.reference, url }, merged: { id: lead.id, reference: lead.reference }, url });
});
