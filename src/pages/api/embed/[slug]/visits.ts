import type { APIRoute } from 'astro';
import { readJson } from '~/lib/server/http';
import { preflight, publicEndpoint } from '~/lib/server/embed/public-api';
import { bookFromWidget } from '~/lib/server/embed/widget-visits';
import { widgetVisitRequestSchema } from '~/lib/shared/widget-visit-schemas';

/**
 * The homeowner books a site visit for the inquiry they have just sent, proving it with the key of
 * their private estimate link: 201 `{visit}`, 409 with `alternatives` when the time has gone.
 */
export const POST: APIRoute = publicEndpoint(
  'embed-visits',
  { perAddress: { points: 10, duration: 600 }, perFirm: { points: 300, duration: 3600 } },
  async ({ em, company, request }) => {
    const body = await readJson(request, widgetVisitRequestSchema);
    return { status: 201, body: await bookFromWidget(em, company, body) };
  },
);

export const OPTIONS: APIRoute = preflight();
