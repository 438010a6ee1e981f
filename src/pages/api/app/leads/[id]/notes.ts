import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { authorize } from '~/lib/server/auth/guard';
import { readJson } from '~/lib/server/http';
import { kickMailDelivery } from '~/lib/server/mail/delivery-job';
import { canEditLead, canSeeLeads } from '~/lib/server/leads/policy';
import { leadOfCompany } from '~/lib/server/leads/lead.repository';
import { addNote } from '~/lib/server/leads/lead-notes';
import { presentEvent } from '~/lib/server/leads/present-event';
import { noteSchema } from '~/lib/shared/inquiry-work-schemas';

/** Adds a note to the inquiry; each teammate it @mentions is e-mailed. Owner and sales. */
export const POST = staffEndpoint({ may: canSeeLeads }, async ({ staff, locals, params, request }) => {
  authorize(staff, canEditLead, await leadOfCompany(locals.em, staff.companyId, params.id ?? ''));
  const { text } = await readJson(request, noteSchema);
  const { event, mailed } = await addNote(locals.em, { companyId: staff.companyId, leadId: params.id!, authorUserId: staff.userId, text });
  if (mailed) kickMailDelivery();
  return Response.json({ event: presentEvent(event), mailed }, { status: 201 });
});
