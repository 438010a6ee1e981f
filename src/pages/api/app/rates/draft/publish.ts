import { staffEndpoint } from '~/lib/server/auth/staff-endpoint';
import { readJson } from '~/lib/server/http';
import { canPublishRates } from '~/lib/server/rates/policy';
import { publishDraft } from '~/lib/server/rates/rate-book-drafts';
import { publishDraftSchema } from '~/lib/shared/rate-book-schemas';

/** Makes the draft the published version (the one every new estimate uses). */
export const POST = staffEndpoint({ may: canPublishRates, hidden: true }, async ({ staff, locals, request }) => {
  return Response.json(await publishDraft(locals.em, staff, await readJson(request, publishDraftSchema)));
});
