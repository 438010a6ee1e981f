import { readJson } from '~/lib/server/http';
import { moveByHomeowner } from '~/lib/server/visits/homeowner-link';
import { linkEndpoint } from '~/lib/server/visits/link-endpoint';
import { rescheduleSchema } from '~/lib/shared/visit-schemas';

/** The homeowner moves their visit to one of the offered times: 200 with the page's new view; 409 with `alternatives`; 410 once the link is closed. */
export const POST = linkEndpoint('visit-link-move', async ({ em, token, request }) => {
  const input = await readJson(request, rescheduleSchema);
  return { status: 200, body: await moveByHomeowner(em, token, { start: new Date(input.start), salespersonId: input.salespersonId }) };
});
