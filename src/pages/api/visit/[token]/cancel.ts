import { readJson } from '~/lib/server/http';
import { cancelByHomeowner } from '~/lib/server/visits/homeowner-link';
import { linkEndpoint } from '~/lib/server/visits/link-endpoint';
import { homeownerCancelSchema } from '~/lib/shared/homeowner-visit';

/** The homeowner cancels their visit (the page asked them to confirm): 200 with the page's new view; 410 once the link is closed. */
export const POST = linkEndpoint('visit-link-cancel', async ({ em, token, request }) => {
  await readJson(request, homeownerCancelSchema);
  return { status: 200, body: await cancelByHomeowner(em, token) };
});
