import type { APIRoute } from 'astro';
import { leadRequestSchema } from '~/lib/shared/lead-schemas';
import { readJson } from '~/lib/server/http';
import { preflight, publicEndpoint } from '~/lib/server/embed/public-api';
import { submitWidgetLead } from '~/lib/server/embed/widget-lead';

/** Turns the homeowner's answers and contact details into a lead (one per idempotency key). */
export const POST: APIRoute = publicEndpoint(
  'embed-leads',
  { perAddress: { points: 10, duration: 600 }, perFirm: { points: 300, duration: 3600 } },
  async ({ em, company, request }) => {
    const body = await readJson(request, leadRequestSchema);
    const lead = await submitWidgetLead(em, company, body);
    return { status: 201, body: { lead: { reference: lead.reference, viewUrl: lead.viewUrl }, estimate: lead.estimate } };
  },
);

export const OPTIONS: APIRoute = preflight();
