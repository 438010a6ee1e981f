import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { canSeeRates } from '~/lib/server/rates/policy';
import { previewSamples } from '~/lib/server/rate-preview/draft-preview';

/** Each finish's sample room priced by the published version and by the saved draft. */
export const GET = staffEndpoint({ may: canSeeRates, hidden: true }, async ({ staff, locals }) =>
  Response.json(await previewSamples(locals.em, staff.companyId)),
);
