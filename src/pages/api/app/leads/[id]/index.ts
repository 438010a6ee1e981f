import { authorize } from '~/lib/server/auth/guard';
import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { purgeDueAt, softDeleteLead } from '~/lib/server/leads/lead-deletion';
import { leadOfCompany } from '~/lib/server/leads/lead.repository';
import { canDeleteLead, canSeeLeads } from '~/lib/server/leads/policy';

/** Deletes an inquiry (owners only): soft, restorable until `purgeAt`. */
export const DELETE = staffEndpoint({ may: canSeeLeads }, async ({ staff, locals, params }) => {
  const lead = await leadOfCompany(locals.em, staff.companyId, params.id ?? '');
  authorize(staff, canDeleteLead, lead);
  await softDeleteLead(locals.em, lead, staff.userId);
  return Response.json({ id: lead.id, reference: lead.reference, deletedAt: lead.deletedAt, purgeAt: purgeDueAt(lead.deletedAt!), url: '/app' });
});
