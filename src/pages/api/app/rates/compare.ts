import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { parseInput } from '~/lib/server/http';
import { canSeeRates } from '~/lib/server/rates/policy';
import { compareVersions } from '~/lib/server/rates/rate-book-drafts';
import { compareVersionsSchema } from '~/lib/shared/rate-book-schemas';

/** Two versions field by field: `?before=ID&after=ID`. */
export const GET = staffEndpoint({ may: canSeeRates, hidden: true }, async ({ staff, locals, url }) => {
  const { before, after } = parseInput(compareVersionsSchema, Object.fromEntries(url.searchParams));
  return Response.json(await compareVersions(locals.em, staff.companyId, before, after));
});
