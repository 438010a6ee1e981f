/**
 * Inquiries that look like the same homeowner: the same e-mail (stored lower-case by the contact
 * schema, so equal means equal ignoring case) or the same phone (stored as E.164), in the same firm,
 * still open (not ended, not deleted, not merged away). Another firm's inquiries never match.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import type { FilterQuery } from '@mikro-orm/core';
import type { LeadStage } from '~/lib/shared/labels';
import { Lead } from './lead.entity';

/** The stages that end an inquiry (see LEAD_STAGES). */
export const ENDED_STAGES: readonly LeadStage[] = ['going-ahead', 'not-going-ahead'];

function openMatching(companyId: string, email: string, phone: string, exceptId?: string): FilterQuery<Lead> {
  return {
    company: companyId,
    deletedAt: null,
    mergedInto: null,
    stage: { $nin: [...ENDED_STAGES] },
    $or: [{ email: email.trim().toLowerCase() }, { phone }],
    ...(exceptId ? { id: { $ne: exceptId } } : {}),
  };
}

/** The newest open inquiry with this e-mail or phone, for flagging a new one as it comes in. */
export function openLeadMatching(em: EntityManager, companyId: string, contact: { email: string; phone: string }): Promise<Lead | null> {
  return em.findOne(Lead, openMatching(companyId, contact.email, contact.phone), { orderBy: { createdAt: 'desc' } });
}

/** Every other open inquiry of the firm that looks like the same homeowner as this one, newest first. */
export function openDuplicatesOf(em: EntityManager, lead: Lead): Promise<Lead[]> {
  return em.find(Lead, openMatching(lead.company.id, lead.email, lead.phone, lead.id), { orderBy: { createdAt: 'desc' }, limit: 10 });
}
