import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { authorize } from '~/lib/server/auth/guard';
import { readJson } from '~/lib/server/http';
import { workableLead } from '~/lib/server/leads/lead-flow';
import { canManageVisit, canSeeVisits } from '~/lib/server/visits/policy';
import { bookVisit } from '~/lib/server/visits/booking';
import { visitView } from '~/lib/server/visits/visit-view';
import { staffBookingSchema } from '~/lib/shared/visit-schemas';

/**
 * Books a site visit for the inquiry (staff, also for a homeowner on the phone): 201 with the
 * visit; 409 with `alternatives` (the next open slots) when the time is not open or was just taken.
 */
export const POST = staffEndpoint({ may: canSeeVisits }, async ({ staff, locals, params, request }) => {
  const lead = await workableLead(locals.em, staff, params.id ?? '');
  authorize(staff, canManageVisit, lead);
  const input = await readJson(request, staffBookingSchema);
  const visit = await bookVisit(locals.em, {
    companyId: staff.companyId,
    leadId: lead.id,
    start: new Date(input.start),
    salespersonId: input.salespersonId,
    via: 'staff',
    bookedByUserId: staff.userId,
    note: input.note,
  });
  return Response.json(await visitView(locals.em, visit), { status: 201 });
});
