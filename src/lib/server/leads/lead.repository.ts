import type { EntityManager } from '@mikro-orm/postgresql';
import { isId } from '~/lib/shared/ids';
import { NotFound } from '../errors';
import { recordLeadEvent } from './lead-events';
import { Lead } from './lead.entity';

/**
 * One of the firm's leads; another firm's id, a malformed one or a deleted lead is simply not
 * found (owners restoring a deleted one pass `includeDeleted`).
 */
export async function leadOfCompany(em: EntityManager, companyId: string, leadId: string, options: { includeDeleted?: boolean } = {}): Promise<Lead> {
  if (!isId(leadId)) throw new NotFound('No such lead.');
  const where = options.includeDeleted ? { id: leadId, company: companyId } : { id: leadId, company: companyId, deletedAt: null };
  const lead = await em.findOne(Lead, where, { populate: ['rateBookVersion', 'company', 'estimate'] });
  if (!lead) throw new NotFound('No such lead.');
  return lead;
}

/** The firm's newest leads, for Inquiries until it has its full table. */
export function recentLeads(em: EntityManager, companyId: string, limit = 25): Promise<Lead[]> {
  return em.find(Lead, { company: companyId, deletedAt: null }, { orderBy: { createdAt: 'desc' }, limit });
}

/** The first time anyone on the staff opens an inquiry it stops being unread, and the timeline says who. */
export async function markLeadOpened(em: EntityManager, lead: Lead, userId: string, now = new Date()): Promise<void> {
  if (lead.openedAt) return;
  // Only the first opener wins, even when two people open it at once.
  const claimed = await em.nativeUpdate(Lead, { id: lead.id, company: lead.company, openedAt: null }, { openedAt: now });
  if (claimed === 0) return;
  lead.openedAt = now;
  recordLeadEvent(em, lead, 'opened', { actorUserId: userId, at: now });
  await em.flush();
}
