import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { canManageTeam } from '~/lib/server/team/policy';
import { NotFound } from '~/lib/server/errors';
import { readJson } from '~/lib/server/http';
import { isId } from '~/lib/shared/ids';
import { changeRole, removeMember } from '~/lib/server/team/team.service';
import { changeRoleSchema } from '~/lib/shared/auth-schemas';

/** Changes a member's role. Owner only. */
export const PATCH = staffEndpoint({ may: canManageTeam, hidden: true }, async ({ staff, locals, params, request }) => {
  if (!isId(params.id)) throw new NotFound();
  const { role } = await readJson(request, changeRoleSchema);
  const member = await changeRole(locals.em, { companyId: staff.companyId, membershipId: params.id, role, actingSessionToken: staff.sessionToken });
  return Response.json(member);
});

/** Removes a member from the active firm. Owner only. */
export const DELETE = staffEndpoint({ may: canManageTeam, hidden: true }, async ({ staff, locals, params }) => {
  if (!isId(params.id)) throw new NotFound();
  await removeMember(locals.em, { companyId: staff.companyId, membershipId: params.id });
  return new Response(null, { status: 204 });
});
