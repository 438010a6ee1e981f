import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { authorize } from '~/lib/server/auth/guard';
import { readJson } from '~/lib/server/http';
import { canEditAvailability, canSeeVisits } from '~/lib/server/visits/policy';
import { availabilityView, membershipOfCompany, saveAvailability } from '~/lib/server/visits/availability';
import { availabilitySchema } from '~/lib/shared/visit-schemas';

/** A person's weekly hours and days off: each person their own, the owner anyone's. */
export const GET = staffEndpoint({ may: canSeeVisits }, async ({ staff, locals, params }) => {
  const membership = await membershipOfCompany(locals.em, staff.companyId, params.membershipId ?? '');
  authorize(staff, canEditAvailability, membership);
  return Response.json(await availabilityView(locals.em, membership));
});

/** Replaces them; 400 with a message per field (`weekly.mon.0.to`, `daysOff.2`). */
export const PUT = staffEndpoint({ may: canSeeVisits }, async ({ staff, locals, params, request }) => {
  const membership = await membershipOfCompany(locals.em, staff.companyId, params.membershipId ?? '');
  authorize(staff, canEditAvailability, membership);
  const input = await readJson(request, availabilitySchema);
  return Response.json(await saveAvailability(locals.em, membership, input));
});
