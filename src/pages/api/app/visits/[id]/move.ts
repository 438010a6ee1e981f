import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { authorize } from '~/lib/server/auth/guard';
import { readJson } from '~/lib/server/http';
import { canManageVisit, canSeeVisits } from '~/lib/server/visits/policy';
import { moveVisit, visitOfCompany } from '~/lib/server/visits/booking';
import { visitView } from '~/lib/server/visits/visit-view';
import { rescheduleSchema } from '~/lib/shared/visit-schemas';

/** Moves a booked visit to another open time (and salesperson); 409 with `alternatives` when it is not open. */
export const POST = staffEndpoint({ may: canSeeVisits }, async ({ staff, locals, params, request }) => {
  authorize(staff, canManageVisit, await visitOfCompany(locals.em, staff.companyId, params.id ?? ''));
  const input = await readJson(request, rescheduleSchema);
  const visit = await moveVisit(locals.em, {
    companyId: staff.companyId,
    visitId: params.id!,
    start: new Date(input.start),
    salespersonId: input.salespersonId,
    by: 'staff',
    actorUserId: staff.userId,
  });
  return Response.json(await visitView(locals.em, visit));
});
