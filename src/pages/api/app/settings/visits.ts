import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { readJson } from '~/lib/server/http';
import { canEditVisitSettings } from '~/lib/server/visits/policy';
import { saveVisitSettings } from '~/lib/server/visits/visit-settings';
import { firmVisitSettingsSchema } from '~/lib/shared/visit-calendar';

/** Replaces the firm's visit settings and time zone. Owner only (Setup → Visits). */
export const PUT = staffEndpoint({ may: canEditVisitSettings, hidden: true }, async ({ staff, locals, request }) => {
  const input = await readJson(request, firmVisitSettingsSchema);
  return Response.json(await saveVisitSettings(locals.em, staff.companyId, input));
});
