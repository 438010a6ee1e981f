/**
 * An inquiry sent from the price widget: the widget's own checks (form token, minimum time,
 * hidden field, idempotency key, service area), then the same estimate as the live range, then
 * `createLead` with the draft's photos attached in the lead's transaction.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import type { HomeownerEstimate } from '~/lib/shared/homeowner-estimate';
import type { LeadRequestParsed } from '~/lib/shared/lead-schemas';
import type { Company } from '../companies/company.entity';
import { servesPostcode } from '../companies/service-area';
import { InvalidInput } from '../errors';
import { createLead, leadForIdempotencyKey, requestDigestOf } from '../leads/lead.service';
import { attachDraftPhotos } from '../photos/lead-photo.service';
import { recordFunnelStep } from './funnel';
import { MIN_SECONDS_TO_SUBMIT } from './human-pace';
import { estimateForDraft, openWidgetDraft } from './widget-estimate';

export type SubmittedLead = {
  /** False when the submission looked automated: the answer looks the same, but nothing is stored. */
  stored: boolean;
  reference: string;
  viewUrl: string | null;
  estimate: HomeownerEstimate | null;
};

export async function submitWidgetLead(em: EntityManager, company: Company, request: LeadRequestParsed, now = Date.now()): Promise<SubmittedLead> {
  const token = openWidgetDraft(company, request.formToken, now);

  const looksAutomated = (request.website ?? '').trim() !== '' || now - token.issuedAt < MIN_SECONDS_TO_SUBMIT * 1000;
  if (looksAutomated) return { stored: false, reference: 'RECEIVED', viewUrl: null, estimate: null };

  const repeated = await leadForIdempotencyKey(em, company, request.idempotencyKey, requestDigestOf(request));
  if (repeated) return { stored: true, reference: repeated.lead.reference, viewUrl: null, estimate: repeated.estimate };

  if (!servesPostcode(company, request.contact.postcode)) {
    throw new InvalidInput('Outside the service area.', {
      'contact.postcode': `Sorry, ${company.name} doesn't work in ${request.contact.postcode} yet. You're welcome to call them all the same${company.phone ? ` on ${company.phone}` : ''}.`,
    });
  }

  const estimate = await estimateForDraft(em, company, token, request.project);
  const created = await createLead(
    em,
    company,
    {
      contact: request.contact,
      project: estimate.project,
      estimate,
      source: 'widget',
      consentAt: new Date(now),
      idempotencyKey: request.idempotencyKey,
      draftId: token.draftId,
      photoCount: estimate.photoCount,
    },
    async (tx, lead) => {
      await attachDraftPhotos(tx, { companyId: company.id, draftId: token.draftId, lead });
      await tx.flush();
      await recordFunnelStep(tx, company.id, token.draftId, 'lead-sent');
    },
  );
  return { stored: true, reference: created.lead.reference, viewUrl: created.viewUrl, estimate: created.estimate };
}
