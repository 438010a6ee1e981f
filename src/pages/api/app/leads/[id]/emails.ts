import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { authorize } from '~/lib/server/auth/guard';
import { readJson } from '~/lib/server/http';
import { kickMailDelivery } from '~/lib/server/mail/delivery-job';
import { canEditLead, canSeeLeads } from '~/lib/server/leads/policy';
import { leadOfCompany } from '~/lib/server/leads/lead.repository';
import { sendLeadEmail } from '~/lib/server/leads/lead-emails';
import { presentEvent } from '~/lib/server/leads/present-event';
import { leadEmailSchema } from '~/lib/shared/inquiry-work-schemas';

/** Sends the homeowner an e-mail (from a template or not) through the outbox, kept on the timeline. Owner and sales. */
export const POST = staffEndpoint({ may: canSeeLeads }, async ({ staff, locals, params, request }) => {
  authorize(staff, canEditLead, await leadOfCompany(locals.em, staff.companyId, params.id ?? ''));
  const input = await readJson(request, leadEmailSchema);
  const event = await sendLeadEmail(locals.em, { companyId: staff.companyId, leadId: params.id!, senderUserId: staff.userId, ...input });
  kickMailDelivery();
  return Response.json({ event: presentEvent(event) }, { status: 201 });
});
