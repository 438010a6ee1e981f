import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { canSeeLeads } from '~/lib/server/leads/policy';
import { undoLeadEvent } from '~/lib/server/leads/lead-flow';
import { timelineView } from '~/lib/server/leads/timeline-view';

/** Undoes the latest stage move or assignment (see `lead-flow.ts`); answers the refreshed timeline. */
export const POST = staffEndpoint({ may: canSeeLeads }, async ({ staff, locals, params }) => {
  const lead = await undoLeadEvent(locals.em, staff, params.id ?? '', params.eventId ?? '');
  return Response.json(await timelineView(locals.em, staff, lead));
});
