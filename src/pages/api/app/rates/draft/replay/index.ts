import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { canSeeRates } from '~/lib/server/rates/policy';
import { startReplay } from '~/lib/server/rate-preview/draft-preview';

/** Replays the last 90 days of inquiries under the saved draft: done at once when small (200), queued when large (202). */
export const POST = staffEndpoint({ may: canSeeRates, hidden: true }, async ({ staff, locals }) => {
  const replay = await startReplay(locals.em, staff.companyId);
  return Response.json(replay, { status: replay.status === 'done' ? 200 : 202 });
});
