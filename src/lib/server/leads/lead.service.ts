import { createHash, randomBytes, timingSafeEqual } from 'node:crypto';
import { UniqueConstraintViolationException } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { z } from 'zod';
import type { leadRequestSchema } from '../../shared/lead-schemas';
import type { Company } from '../companies/company.entity';
import { config } from '../config';
import { InvalidInput, NotFound } from '../errors';
import { verifyFormToken } from '../embed/form-token';
import { estimateWithPublishedRates } from '../embed/estimate.service';
import { recordFunnelStep } from '../embed/funnel';
import { presentForHomeowner, type HomeownerEstimate } from '../embed/present-estimate';
import { enqueueMail } from '../mail/outbox';
import { kickMailDelivery } from '../mail/worker';
import { LeadPhoto } from '../photos/lead-photo.entity';
import { attachDraftPhotos } from '../photos/lead-photo.service';
import { Lead } from './lead.entity';
import { homeownerConfirmation, newLeadAlert } from './lead-mail';
import { newLeadReference } from './lead-reference';

export type LeadRequest = z.output<typeof leadRequestSchema>;

/** Humans take longer than this between opening the form and sending it; scripts often do not. */
export const MIN_SECONDS_TO_SUBMIT = 4;

export type SubmittedLead = {
  /** False when the submission looked automated: the answer looks the same, but nothing is stored. */
  stored: boolean;
  reference: string;
  viewUrl: string | null;
  estimate: HomeownerEstimate | null;
};

const digest = (token: string) => createHash('sha256').update(token).digest('hex');

export function leadViewUrl(leadId: string, token: string): string {
  return `${config.publicOrigin}/estimate/${leadId}?key=${token}`;
}

export function staffLeadUrl(leadId: string): string {
  return `${config.publicOrigin}/app/leads/${leadId}`;
}

/** Whether a postcode is inside the firm's service area (leading characters match; empty list = anywhere). */
export function servesPostcode(company: Company, postcode: string): boolean {
  const compact = postcode.replace(/[\s-]/g, '').toUpperCase();
  return company.servicePostcodes.length === 0 || company.servicePostcodes.some((prefix) => compact.startsWith(prefix.replace(/[\s-]/g, '').toUpperCase()));
}

/** Ready photos uploaded under a widget draft. */
export function readyPhotoCount(em: EntityManager, companyId: string, draftId: string): Promise<number> {
  return em.count(LeadPhoto, { company: companyId, draftId, status: 'ready' });
}

/**
 * Turns a homeowner's submission into a lead: recomputes the estimate on the server, stores the
 * lead with its photos and both e-mails in one transaction, and answers the same lead again for a
 * repeated idempotency key.
 */
export async function submitLead(em: EntityManager, company: Company, request: LeadRequest, now = Date.now()): Promise<SubmittedLead> {
  const token = verifyFormToken(request.formToken, company.id, now);

  const looksAutomated = (request.website ?? '').trim() !== '' || now - token.issuedAt < MIN_SECONDS_TO_SUBMIT * 1000;
  if (looksAutomated) return { stored: false, reference: 'RECEIVED', viewUrl: null, estimate: null };

  const existing = await em.findOne(Lead, { company, idempotencyKey: request.idempotencyKey });
  if (existing) return answerFor(existing);

  if (!servesPostcode(company, request.contact.postcode)) {
    throw new InvalidInput('Outside the service area.', {
      'contact.postcode': `Sorry, ${company.name} doesn't work in ${request.contact.postcode} yet. You're welcome to call them all the same${company.phone ? ` on ${company.phone}` : ''}.`,
    });
  }

  const photoCount = await readyPhotoCount(em, company.id, token.draftId);
  const project = { ...request.project, photoCount };
  const { result, rates } = await estimateWithPublishedRates(em, company, project);
  const view = presentForHomeowner(result);
  const viewToken = randomBytes(24).toString('base64url');

  try {
    const lead = await em.transactional(async (tx) => {
      const lead = tx.create(Lead, {
        company,
        reference: newLeadReference(),
        name: request.contact.name,
        email: request.contact.email,
        phone: request.contact.phone,
        address: request.contact.address,
        postcode: request.contact.postcode,
        preferredContact: request.contact.preferredContact,
        message: request.contact.message || null,
        consentAt: new Date(now),
        inputs: project as unknown as Record<string, unknown>,
        estimate: result as unknown as Record<string, unknown>,
        rateBookVersion: rates.version,
        rangeLowCents: result.price.lowCents,
        rangeHighCents: result.price.highCents,
        idempotencyKey: request.idempotencyKey,
        draftId: token.draftId,
        viewTokenHash: digest(viewToken),
      });
      await attachDraftPhotos(tx, { companyId: company.id, draftId: token.draftId, lead });

      const facts = { ...request.contact, reference: lead.reference, message: lead.message };
      const confirmation = homeownerConfirmation(company, facts, view, leadViewUrl(lead.id, viewToken));
      enqueueMail(tx, { to: lead.email, ...confirmation, companyId: company.id, replyTo: company.notificationEmails[0] });
      const alert = newLeadAlert(company, facts, view, staffLeadUrl(lead.id), photoCount);
      for (const to of company.notificationEmails) enqueueMail(tx, { to, ...alert, companyId: company.id, replyTo: lead.email });
      await tx.flush();
      await recordFunnelStep(tx, company.id, token.draftId, 'lead-sent');
      return lead;
    });
    kickMailDelivery();
    return { stored: true, reference: lead.reference, viewUrl: leadViewUrl(lead.id, viewToken), estimate: view };
  } catch (error) {
    // Two sends with one key raced: the other one stored the lead.
    if (error instanceof UniqueConstraintViolationException) {
      const raced = await em.fork().findOne(Lead, { company, idempotencyKey: request.idempotencyKey });
      if (raced) return answerFor(raced);
    }
    throw error;
  }
}

function answerFor(lead: Lead): SubmittedLead {
  // The private link's secret is only shown once; a repeat answer carries the rest.
  return { stored: true, reference: lead.reference, viewUrl: null, estimate: presentForHomeowner(lead.estimate as never) };
}

/** The homeowner's private view of their estimate; a wrong key looks like a missing lead. */
export async function leadForViewKey(em: EntityManager, leadId: string, key: string): Promise<Lead> {
  if (!/^[0-9a-f-]{36}$/.test(leadId) || !/^[A-Za-z0-9_-]{20,64}$/.test(key)) throw new NotFound();
  const lead = await em.findOne(Lead, { id: leadId }, { populate: ['company'] });
  if (!lead) throw new NotFound();
  const expected = Buffer.from(lead.viewTokenHash, 'hex');
  const given = Buffer.from(digest(key), 'hex');
  if (!timingSafeEqual(expected, given)) throw new NotFound();
  return lead;
}
