import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { InvalidInput } from '~/lib/server/errors';
import { canSeeVisits } from '~/lib/server/visits/policy';
import { openSlotsOfFirm } from '~/lib/server/visits/open-slots';
import { slotView } from '~/lib/server/visits/booking';
import { Membership } from '~/lib/server/users/membership.entity';
import { isId } from '~/lib/shared/ids';

/** Open slots for staff booking: one salesperson's (`?salespersonId=`) or the team's; the minimum notice does not apply to staff. */
export const GET = staffEndpoint({ may: canSeeVisits }, async ({ staff, locals, url }) => {
  const salespersonId = url.searchParams.get('salespersonId') || undefined;
  if (salespersonId && (!isId(salespersonId) || !(await locals.em.findOne(Membership, { id: salespersonId, company: staff.companyId })))) {
    throw new InvalidInput('Some fields need attention.', { salespersonId: 'Choose someone on your team.' });
  }
  const slots = await openSlotsOfFirm(locals.em, staff.companyId, { salespersonId, ignoreNotice: true });
  return Response.json({ slots: slots.map(slotView) });
});
