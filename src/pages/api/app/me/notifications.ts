import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { readJson } from '~/lib/server/http';
import { setNewInquiryMail } from '~/lib/server/leads/new-inquiry-mail';
import { notificationSettingsSchema } from '~/lib/shared/intake-schemas';

/** The signed-in person's e-mail settings in the firm they are working in: new-inquiry e-mails on or off. */
export const PATCH = staffEndpoint({}, async ({ staff, locals, request }) => {
  const { newInquiryMail } = await readJson(request, notificationSettingsSchema);
  return Response.json(await setNewInquiryMail(locals.em, { companyId: staff.companyId, membershipId: staff.membership.id, on: newInquiryMail }));
});
