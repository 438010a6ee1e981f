import type { APIRoute } from 'astro';
import { estimateRequestSchema } from '~/lib/shared/lead-schemas';
import { readJson } from '~/lib/server/http';
import { recordFunnelStep } from '~/lib/server/embed/funnel';
import { preflight, publicEndpoint } from '~/lib/server/embed/public-api';
import { estimateForDraft, openWidgetDraft } from '~/lib/server/embed/widget-estimate';

/** The widget's live price range, computed from the firm's published rates (which stay here). */
export const POST: APIRoute = publicEndpoint(
  'embed-estimate',
  { perAddress: { points: 60, duration: 60 }, perFirm: { points: 3000, duration: 60 } },
  async ({ em, company, request }) => {
    const body = await readJson(request, estimateRequestSchema);
    const token = openWidgetDraft(company, body.formToken);
    const { view } = await estimateForDraft(em, company, token, body.project);
    await recordFunnelStep(em, company.id, token.draftId, 'first-estimate');
    return { status: 200, body: { estimate: view } };
  },
);

export const OPTIONS: APIRoute = preflight();
