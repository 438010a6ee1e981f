import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { canSeeLeads } from '~/lib/server/leads/policy';
import { readJson } from '~/lib/server/http';
import { setFollowUp, workableLead } from '~/lib/server/leads/lead-flow';
import { timelineView } from '~/lib/server/leads/timeline-view';
import { followUpSchema } from '~/lib/shared/lead-flow-schemas';

/** Sets or clears the next follow-up (a date and time on the firm's clock); answers the refreshed timeline. */
export const PUT = staffEndpoint({ may: canSeeLeads }, async ({ staff, locals, params, request }) => {
  await workableLead(locals.em, staff, params.id ?? '');
  const { at } = await readJson(request, followUpSchema);
  const lead = await setFollowUp(locals.em, staff, params.id!, at);
  return Response.json(await timelineView(locals.em, staff, lead));
});
