import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { authorize } from '~/lib/server/auth/guard';
import { canManageVisit, canSeeVisits } from '~/lib/server/visits/policy';
import { cancelVisit, visitOfCompany } from '~/lib/server/visits/booking';
import { visitView } from '~/lib/server/visits/visit-view';

/** Cancels a booked visit; the homeowner and the salesperson get a cancellation. */
export const POST = staffEndpoint({ may: canSeeVisits }, async ({ staff, locals, params }) => {
  authorize(staff, canManageVisit, await visitOfCompany(locals.em, staff.companyId, params.id ?? ''));
  const visit = await cancelVisit(locals.em, { companyId: staff.companyId, visitId: params.id!, by: 'staff', actorUserId: staff.userId });
  return Response.json(await visitView(locals.em, visit));
});
