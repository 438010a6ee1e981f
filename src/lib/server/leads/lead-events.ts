import type { EntityManager } from '@mikro-orm/postgresql';
import type { LeadEventKind } from '~/lib/shared/lead-events';
import { LeadEvent } from './lead-event.entity';
import type { Lead } from './lead.entity';

/**
 * Adds one entry to an inquiry's timeline (persisted on the next flush, so it commits with the
 * change it records). `actorUserId` is null for the homeowner and for the app itself.
 */
export function recordLeadEvent(
  em: EntityManager,
  lead: Lead,
  kind: LeadEventKind,
  options: { actorUserId?: string | null; at?: Date; data?: Record<string, unknown> } = {},
): LeadEvent {
  return em.create(LeadEvent, {
    company: lead.company,
    lead,
    kind,
    actor: options.actorUserId ?? null,
    at: options.at ?? new Date(),
    data: options.data ?? {},
  });
}

/** The inquiry's timeline, oldest first. */
export function leadTimeline(em: EntityManager, companyId: string, leadId: string): Promise<LeadEvent[]> {
  return em.find(LeadEvent, { company: companyId, lead: leadId }, { orderBy: { at: 'asc', createdAt: 'asc' }, populate: ['actor'] });
}
