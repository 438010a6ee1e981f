import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { canSeeRates } from '~/lib/server/rates/policy';
import { rateBookOverview } from '~/lib/server/rates/rate-book-drafts';

/** The firm's Rate book versions: the published one, the draft (with its numbers) and the list. Owners only; others 404. */
export const GET = staffEndpoint({ may: canSeeRates, hidden: true }, async ({ staff, locals }) =>
  Response.json(await rateBookOverview(locals.em, staff.companyId)),
);
