import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { canUseSetup } from '~/lib/server/companies/policy';
import { saveWidgetSites } from '~/lib/server/companies/firm-settings';
import { readJson } from '~/lib/server/http';
import { widgetSitesSchema } from '~/lib/shared/setup-schemas';

/** Replaces the sites allowed to embed the price widget. Owner only (Setup); others get 404. */
export const PUT = staffEndpoint({ may: canUseSetup, hidden: true }, async ({ staff, locals, request }) => {
  const input = await readJson(request, widgetSitesSchema);
  return Response.json(await saveWidgetSites(locals.em, staff.companyId, input));
});
