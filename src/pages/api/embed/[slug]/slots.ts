import type { APIRoute } from 'astro';
import { InvalidInput } from '~/lib/server/errors';
import { preflight, publicEndpoint } from '~/lib/server/embed/public-api';
import { widgetSlots } from '~/lib/server/embed/widget-visits';
import { inquiryProofSchema } from '~/lib/shared/widget-visit-schemas';

/**
 * Open visit times for the widget's visit step: the team's, or with `?lead=ID&key=KEY` (the
 * homeowner's private estimate link) the assigned salesperson's. `offered: false` when the firm
 * does not book online or nobody has hours.
 */
export const GET: APIRoute = publicEndpoint(
  'embed-slots',
  { perAddress: { points: 30, duration: 60 }, perFirm: { points: 1500, duration: 60 } },
  async ({ em, company, request }) => {
    const query = new URL(request.url).searchParams;
    const lead = query.get('lead');
    const key = query.get('key');
    let proof = null;
    if (lead !== null || key !== null) {
      const parsed = inquiryProofSchema.safeParse({ lead: lead ?? undefined, key: key ?? undefined });
      if (!parsed.success) throw new InvalidInput('Some fields need attention.', { lead: 'Send the inquiry first.' });
      proof = parsed.data;
    }
    return { status: 200, body: await widgetSlots(em, company, proof) };
  },
);

export const OPTIONS: APIRoute = preflight();
