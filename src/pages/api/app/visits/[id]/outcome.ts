import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { authorize } from '~/lib/server/auth/guard';
import { readJson } from '~/lib/server/http';
import { canManageVisit, canSeeVisits } from '~/lib/server/visits/policy';
import { visitOfCompany } from '~/lib/server/visits/booking';
import { recordVisitOutcome } from '~/lib/server/visits/visit-outcome';
import { visitView } from '~/lib/server/visits/visit-view';
import { visitOutcomeSchema } from '~/lib/shared/visit-schemas';

/** Marks a visit that has begun done or no one home; 409 before its start or once it is no longer booked. */
export const POST = staffEndpoint({ may: canSeeVisits }, async ({ staff, locals, params, request }) => {
  // Another firm's id is not found before anything about the body is said.
  authorize(staff, canManageVisit, await visitOfCompany(locals.em, staff.companyId, params.id ?? ''));
  const input = await readJson(request, visitOutcomeSchema);
  const visit = await recordVisitOutcome(locals.em, { companyId: staff.companyId, visitId: params.id!, outcome: input.outcome, actorUserId: staff.userId });
  return Response.json(await visitView(locals.em, visit));
});
