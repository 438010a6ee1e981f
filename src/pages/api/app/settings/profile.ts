import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { canUseSetup } from '~/lib/server/companies/policy';
import { saveFirmProfile } from '~/lib/server/companies/firm-settings';
import { readJson } from '~/lib/server/http';
import { firmProfileSchema } from '~/lib/shared/setup-schemas';

/** Replaces the firm's profile (name, contact, address, time zone, brand colour). Owner only (Setup); others get 404. */
export const PUT = staffEndpoint({ may: canUseSetup, hidden: true }, async ({ staff, locals, request }) => {
  const input = await readJson(request, firmProfileSchema);
  return Response.json(await saveFirmProfile(locals.em, staff.companyId, input));
});
