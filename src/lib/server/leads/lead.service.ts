import { createHash, randomBytes, randomUUID } from 'node:crypto';
import { UniqueConstraintViolationException } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { Project } from '~/lib/estimate';
import { isId } from '~/lib/shared/ids';
import type { LeadSource } from '~/lib/shared/labels';
import type { Contact } from '~/lib/shared/lead-schemas';
import type { Company } from '../companies/company.entity';
import { config } from '../config';
import { NotFound, UnprocessableContent } from '../errors';
import type { FirmEstimate } from '../estimates/estimate.service';
import { estimateSnapshot } from '../estimates/estimate-snapshot';
import { presentForHomeowner, type HomeownerEstimate } from '../estimates/present-estimate';
import { enqueueMail } from '../mail/outbox';
import { kickMailDelivery } from '../mail/delivery-job';
import { Lead } from './lead.entity';
import { leadInputs } from './lead-inputs';
import { firmReplyTo, homeownerConfirmation, newLeadAlert } from './lead-mail';
import { roomChoices } from './room-choices';
import { newLeadReference } from './lead-reference';
import { recordLeadEvent } from './lead-events';
import { viewKeyOpens } from './lead-view-keys';
import { openLeadMatching } from './duplicates';
import { newInquiryRecipients } from './new-inquiry-mail';
import { refreshTriageScore } from './triage';

const digest = (text: string) => createHash('sha256').update(text).digest('hex');

export function leadViewUrl(leadId: string, token: string): string {
  return `${config.publicOrigin}/estimate/${leadId}?key=${token}`;
}

export function staffLeadUrl(leadId: string): string {
  return `${config.publicOrigin}/app/leads/${leadId}`;
}

export type NewLead = {
  contact: Contact;
  /** The project as priced, photo count included. */
  project: Project;
  estimate: FirmEstimate;
  source: LeadSource;
  consentAt: Date;
  /** The sender's key: the same key again answers the same lead. Staff entries get a fresh one. */
  idempotencyKey?: string;
  /** The widget draft its photos were uploaded under. */
  draftId?: string | null;
  /** Photos that go with it, for the firm's alert. */
  photoCount?: number;
  /** The staff member who typed it in (a phone inquiry); absent for the widget. */
  enteredByUserId?: string | null;
};

export type CreatedLead = {
  lead: Lead;
  /** The homeowner's private link; only known when the lead was created by this call. */
  viewUrl: string | null;
  estimate: HomeownerEstimate;
};

/** Everything that was sent with an idempotency key, as one digest. Parsed input has a fixed key order. */
export function requestDigestOf(input: { project: Project; contact: Contact }): string {
  return digest(JSON.stringify({ project: input.project, contact: input.contact }));
}

/**
 * The lead an idempotency key already made, or null. The same key with a different body is refused
 * (422), as the IETF Idempotency-Key draft describes, instead of silently answering the first lead.
 */
export async function leadForIdempotencyKey(em: EntityManager, company: Company, key: string, requestDigest: string): Promise<CreatedLead | null> {
  const existing = await em.findOne(Lead, { company, idempotencyKey: key }, { populate: ['estimate'] });
  if (!existing) return null;
  if (existing.requestDigest && existing.requestDigest !== requestDigest) {
    throw new UnprocessableContent('This request key was already used for a different inquiry. Reload the page and send again.', {
      idempotencyKey: 'Already used for a different inquiry.',
    });
  }
  // The private link's secret is only shown once; a repeat answer carries the rest.
  return { lead: existing, viewUrl: null, estimate: presentForHomeowner(estimateSnapshot.read(existing.estimate)) };
}

/**
 * Stores a new lead with its estimate snapshot and Rate book version, and queues the homeowner's
 * confirmation and the firm's alert in the same transaction. `inTransaction` runs inside that
 * transaction after the lead is created (the widget attaches the draft's photos there). A race on
 * one idempotency key answers the lead the other request stored.
 */
export async function createLead(
  em: EntityManager,
  company: Company,
  input: NewLead,
  inTransaction?: (tx: EntityManager, lead: Lead) => Promise<void>,
): Promise<CreatedLead> {
  const viewToken = randomBytes(24).toString('base64url');
  const idempotencyKey = input.idempotencyKey ?? randomUUID();
  const requestDigest = input.idempotencyKey ? requestDigestOf(input) : null;
  const { result, version, view } = input.estimate;
  try {
    const lead = await em.transactional(async (tx) => {
      // Looked up before the new row exists, so it can never match itself.
      const duplicateOf = await openLeadMatching(tx, company.id, input.contact);
      const lead = tx.create(Lead, {
        company,
        reference: newLeadReference(),
        source: input.source,
        name: input.contact.name,
        email: input.contact.email,
        phone: input.contact.phone,
        address: input.contact.address,
        postcode: input.contact.postcode,
        preferredContact: input.contact.preferredContact,
        message: input.contact.message || null,
        consentAt: input.consentAt,
        inputs: leadInputs.wrap(input.project),
        estimate: estimateSnapshot.wrap(result),
        rateBookVersion: version,
        rangeLowCents: result.price.lowCents,
        rangeHighCents: result.price.highCents,
        idempotencyKey,
        requestDigest,
        draftId: input.draftId ?? null,
        viewTokenHash: digest(viewToken),
        duplicateOf,
      });
      await refreshTriageScore(tx, lead);
      recordLeadEvent(tx, lead, 'received', { actorUserId: input.enteredByUserId ?? null, at: lead.createdAt, data: { source: lead.source } });
      await inTransaction?.(tx, lead);

      const facts = { ...input.contact, reference: lead.reference, message: lead.message };
      const choices = roomChoices(result.takeoff.rooms, result.takeoff.units);
      const confirmation = homeownerConfirmation(company, facts, view, leadViewUrl(lead.id, viewToken), choices);
      enqueueMail(tx, { to: lead.email, ...confirmation, companyId: company.id, fromName: company.name, replyTo: firmReplyTo(company) });
      const alert = newLeadAlert(company, facts, view, staffLeadUrl(lead.id), input.photoCount ?? 0, choices);
      for (const to of await newInquiryRecipients(tx, company.id)) enqueueMail(tx, { to, ...alert, companyId: company.id, replyTo: lead.email });
      await tx.flush();
      return lead;
    });
    kickMailDelivery();
    return { lead, viewUrl: leadViewUrl(lead.id, viewToken), estimate: view };
  } catch (error) {
    // Two sends with one key raced: the other one stored the lead.
    if (error instanceof UniqueConstraintViolationException && requestDigest) {
      const raced = await leadForIdempotencyKey(em.fork(), company, idempotencyKey, requestDigest);
      if (raced) return raced;
    }
    throw error;
  }
}

/** The homeowner's private view of their estimate; a wrong key looks like a missing lead. */
export async function leadForViewKey(em: EntityManager, leadId: string, key: string): Promise<Lead> {
  if (!isId(leadId) || !/^[A-Za-z0-9_-]{20,64}$/.test(key)) throw new NotFound();
  const lead = await em.findOne(Lead, { id: leadId }, { populate: ['company', 'estimate'] });
  if (!lead) throw new NotFound();
  // The confirmation's key, or one minted for an e-mail sent from the inquiry page since.
  if (!(await viewKeyOpens(em, lead, key))) throw new NotFound();
  return lead;
}
