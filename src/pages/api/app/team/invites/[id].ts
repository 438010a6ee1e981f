import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { canManageTeam } from '~/lib/server/team/policy';
import { NotFound } from '~/lib/server/errors';
import { cancelInvite } from '~/lib/server/team/team.service';
import { isId } from '~/lib/shared/ids';

/** Withdraws an open invitation of the active firm. Owner only. */
export const DELETE = staffEndpoint({ may: canManageTeam, hidden: true }, async ({ staff, locals, params }) => {
  if (!isId(params.id)) throw new NotFound();
  await cancelInvite(locals.em, { companyId: staff.companyId, inviteId: params.id });
  return new Response(null, { status: 204 });
});
