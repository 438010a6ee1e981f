import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { canUseSetup } from '~/lib/server/companies/policy';
import { saveNotifications } from '~/lib/server/companies/firm-settings';
import { readJson } from '~/lib/server/http';
import { notificationsSchema } from '~/lib/shared/setup-schemas';

/** Replaces who else hears of new inquiries, and the response target. Owner only (Setup); others get 404. */
export const PUT = staffEndpoint({ may: canUseSetup, hidden: true }, async ({ staff, locals, request }) => {
  const input = await readJson(request, notificationsSchema);
  return Response.json(await saveNotifications(locals.em, staff.companyId, input));
});
