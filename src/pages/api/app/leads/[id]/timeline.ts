import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { canSeeLeads } from '~/lib/server/leads/policy';
import { workableLead } from '~/lib/server/leads/lead-flow';
import { timelineView } from '~/lib/server/leads/timeline-view';

/** The inquiry's timeline, oldest first, with its stage, assignee and follow-up as they stand. */
export const GET = staffEndpoint({ may: canSeeLeads }, async ({ staff, locals, params }) => {
  const lead = await workableLead(locals.em, staff, params.id ?? '');
  return Response.json(await timelineView(locals.em, staff, lead));
});
