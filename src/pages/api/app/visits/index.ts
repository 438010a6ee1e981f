import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { parseInput } from '~/lib/server/http';
import { canSeeVisits } from '~/lib/server/visits/policy';
import { calendarVisits } from '~/lib/server/visits/calendar';
import { calendarQuerySchema } from '~/lib/shared/visit-calendar';

/**
 * The firm's visits overlapping `from`–`to` (at most 42 days), everyone's or one salesperson's
 * (`salespersonId`). Cancelled visits are left out.
 */
export const GET = staffEndpoint({ may: canSeeVisits }, async ({ staff, locals, url }) => {
  const query = parseInput(calendarQuerySchema, Object.fromEntries(url.searchParams));
  return Response.json({ visits: await calendarVisits(locals.em, staff.companyId, query) });
});
