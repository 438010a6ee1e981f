import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { NotFound } from '~/lib/server/errors';
import { canSeeRates } from '~/lib/server/rates/policy';
import { replayOf } from '~/lib/server/rate-preview/draft-preview';
import { isId } from '~/lib/shared/ids';

/** A replay's progress, then its summary. */
export const GET = staffEndpoint({ may: canSeeRates, hidden: true }, async ({ staff, locals, params }) => {
  if (!isId(params.id)) throw new NotFound('No such replay.');
  return Response.json(await replayOf(locals.em, staff.companyId, params.id!));
});
