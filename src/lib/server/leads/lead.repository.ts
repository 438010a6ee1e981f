import type { EntityManager } from '@mikro-orm/postgresql';
import { isId } from '~/lib/shared/ids';
import { NotFound } from '../errors';
import { Lead } from './lead.entity';

/** One of the firm's leads; another firm's id or a malformed one is simply not found. */
export async function leadOfCompany(em: EntityManager, companyId: string, leadId: string): Promise<Lead> {
  if (!isId(leadId)) throw new NotFound('No such lead.');
  const lead = await em.findOne(Lead, { id: leadId, company: companyId }, { populate: ['rateBookVersion', 'company', 'estimate'] });
  if (!lead) throw new NotFound('No such lead.');
  return lead;
}

/** The firm's newest leads, for Inquiries until it has its full table. */
export function recentLeads(em: EntityManager, companyId: string, limit = 25): Promise<Lead[]> {
  return em.find(Lead, { company: companyId }, { orderBy: { createdAt: 'desc' }, limit });
}
