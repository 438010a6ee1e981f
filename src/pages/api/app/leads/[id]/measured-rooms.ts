import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { authorize } from '~/lib/server/auth/guard';
import { readJson } from '~/lib/server/http';
import { canEditLead, canSeeLeads } from '~/lib/server/leads/policy';
import { workableLead } from '~/lib/server/leads/lead-flow';
import { timelineView } from '~/lib/server/leads/timeline-view';
import { saveMeasuredRooms } from '~/lib/server/visits/measured-rooms';
import { measuredRoomsSchema } from '~/lib/shared/measured-rooms-schemas';

/**
 * Saves the rooms measured on the site visit and re-prices the inquiry as a site measurement;
 * answers the new range and the refreshed timeline. 409 until a visit of the inquiry is done.
 */
export const PUT = staffEndpoint({ may: canSeeLeads }, async ({ staff, locals, params, request }) => {
  authorize(staff, canEditLead, await workableLead(locals.em, staff, params.id ?? ''));
  const input = await readJson(request, measuredRoomsSchema);
  const lead = await saveMeasuredRooms(locals.em, staff, params.id!, input.project);
  return Response.json({ range: { lowCents: lead.rangeLowCents, highCents: lead.rangeHighCents }, timeline: await timelineView(locals.em, staff, lead) });
});
