import type { APIRoute } from 'astro';
import { estimateRequestSchema } from '../../../../lib/shared/lead-schemas';
import { readJson } from '../../../../lib/server/http';
import { verifyFormToken } from '../../../../lib/server/embed/form-token';
import { estimateWithPublishedRates } from '../../../../lib/server/embed/estimate.service';
import { recordFunnelStep } from '../../../../lib/server/embed/funnel';
import { presentForHomeowner } from '../../../../lib/server/embed/present-estimate';
import { preflight, publicEndpoint } from '../../../../lib/server/embed/public-api';
import { readyPhotoCount } from '../../../../lib/server/leads/lead.service';

/** The widget's live price range, computed from the firm's published rates (which stay here). */
export const POST: APIRoute = publicEndpoint(
  'embed-estimate',
  { perAddress: { points: 60, duration: 60 }, perFirm: { points: 3000, duration: 60 } },
  async ({ em, company, request }) => {
    const body = await readJson(request, estimateRequestSchema);
    const token = verifyFormToken(body.formToken, company.id);
    // The photo count that widens or narrows the range is what actually arrived, not what the page says.
    const photoCount = await readyPhotoCount(em, company.id, token.draftId);
    const { result } = await estimateWithPublishedRates(em, company, { ...body.project, photoCount });
    await recordFunnelStep(em, company.id, token.draftId, 'first-estimate');
    return { status: 200, body: { estimate: presentForHomeowner(result) } };
  },
);

export const OPTIONS: APIRoute = preflight();
