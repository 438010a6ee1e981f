import { authorize } from '~/lib/server/auth/guard';
import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { deletedLeadOfCompany, restoreLead } from '~/lib/server/leads/lead-deletion';
import { canDeleteLead, canSeeLeads } from '~/lib/server/leads/policy';

/** Brings a deleted inquiry back (owners only), within 30 days of its deletion. */
export const POST = staffEndpoint({ may: canSeeLeads }, async ({ staff, locals, params }) => {
  const lead = await deletedLeadOfCompany(locals.em, staff.companyId, params.id ?? '');
  authorize(staff, canDeleteLead, lead);
  await restoreLead(locals.em, lead, staff.userId);
  return Response.json({ id: lead.id, reference: lead.reference, url: `/app/leads/${lead.id}` });
});
