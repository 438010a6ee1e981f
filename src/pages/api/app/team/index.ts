import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { canManageTeam } from '~/lib/server/team/policy';
import { listTeam } from '~/lib/server/team/team.service';

/** The active firm's members and open invitations. Owner only. */
export const GET = staffEndpoint({ may: canManageTeam, hidden: true }, async ({ staff, locals }) => Response.json(await listTeam(locals.em, staff.companyId)));
