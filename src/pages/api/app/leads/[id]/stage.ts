import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { canSeeLeads } from '~/lib/server/leads/policy';
import { readJson } from '~/lib/server/http';
import { moveStage, workableLead } from '~/lib/server/leads/lead-flow';
import { timelineView } from '~/lib/server/leads/timeline-view';
import { stageMoveSchema } from '~/lib/shared/lead-flow-schemas';

/** Moves the inquiry to another stage (rules in `~/lib/shared/stage-rules`); answers the refreshed timeline. */
export const POST = staffEndpoint({ may: canSeeLeads }, async ({ staff, locals, params, request }) => {
  // Another firm's id is not found before anything about the body is said.
  await workableLead(locals.em, staff, params.id ?? '');
  const input = await readJson(request, stageMoveSchema);
  const lead = await moveStage(locals.em, staff, params.id!, input);
  return Response.json(await timelineView(locals.em, staff, lead));
});
