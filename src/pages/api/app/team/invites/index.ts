import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { canManageTeam } from '~/lib/server/team/policy';
import { readJson } from '~/lib/server/http';
import { kickMailDelivery } from '~/lib/server/mail/delivery-job';
import { inviteToTeam } from '~/lib/server/team/team.service';
import { inviteSchema } from '~/lib/shared/auth-schemas';

/** Invites a person by e-mail with a role. Owner only. */
export const POST = staffEndpoint({ may: canManageTeam, hidden: true }, async ({ staff, locals, request }) => {
  const input = await readJson(request, inviteSchema);
  const invite = await inviteToTeam(locals.em, { companyId: staff.companyId, invitedById: staff.user.id, ...input });
  kickMailDelivery();
  return Response.json(invite, { status: 201 });
});
