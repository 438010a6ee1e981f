import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { canSeeLeads } from '~/lib/server/leads/policy';
import { readJson } from '~/lib/server/http';
import { assignLead, workableLead } from '~/lib/server/leads/lead-flow';
import { timelineView } from '~/lib/server/leads/timeline-view';
import { assigneeSchema } from '~/lib/shared/lead-flow-schemas';

/** Gives the inquiry to someone on the team (or to nobody); answers the refreshed timeline. */
export const PUT = staffEndpoint({ may: canSeeLeads }, async ({ staff, locals, params, request }) => {
  await workableLead(locals.em, staff, params.id ?? '');
  const { membershipId } = await readJson(request, assigneeSchema);
  const lead = await assignLead(locals.em, staff, params.id!, membershipId);
  return Response.json(await timelineView(locals.em, staff, lead));
});
