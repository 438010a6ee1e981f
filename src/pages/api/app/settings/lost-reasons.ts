import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { canSeeLeads } from '~/lib/server/leads/policy';
import { canUseSetup } from '~/lib/server/companies/policy';
import { readJson } from '~/lib/server/http';
import { lostReasonsOf, saveLostReasons } from '~/lib/server/leads/lost-reasons';
import { lostReasonsSchema } from '~/lib/shared/lead-flow-schemas';

/** The firm's reasons an inquiry is not going ahead (everyone who moves inquiries picks from them). */
export const GET = staffEndpoint({ may: canSeeLeads }, async ({ staff, locals }) => {
  return Response.json({ reasons: await lostReasonsOf(locals.em, staff.companyId) });
});

/** Replaces the list. Owner only (Setup). */
export const PUT = staffEndpoint({ may: canUseSetup, hidden: true }, async ({ staff, locals, request }) => {
  const { reasons } = await readJson(request, lostReasonsSchema);
  return Response.json({ reasons: await saveLostReasons(locals.em, staff.companyId, reasons) });
});
