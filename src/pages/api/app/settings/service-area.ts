import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { canUseSetup } from '~/lib/server/companies/policy';
import { saveServiceArea } from '~/lib/server/companies/firm-settings';
import { readJson } from '~/lib/server/http';
import { serviceAreaSchema } from '~/lib/shared/setup-schemas';

/** Replaces the service area (a list of postcodes, or a distance from the office). Owner only (Setup); others get 404. */
export const PUT = staffEndpoint({ may: canUseSetup, hidden: true }, async ({ staff, locals, request }) => {
  const input = await readJson(request, serviceAreaSchema);
  return Response.json(await saveServiceArea(locals.em, staff.companyId, input));
});
