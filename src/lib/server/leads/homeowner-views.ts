import type { EntityManager } from '@mikro-orm/postgresql';
import { now } from '../clock';
import { LeadEvent } from './lead-event.entity';
import { recordLeadEvent } from './lead-events';
import type { Lead } from './lead.entity';

/** Views of the private link closer together than this make one timeline entry. common practice, no source. */
export const HOMEOWNER_VIEW_QUIET_MS = 60 * 60 * 1000;

/**
 * Records that the homeowner opened their private estimate link: a `viewed-by-homeowner` entry
 * (data `{}`, no actor), at most one per lead per hour, so reloading the page does not flood the
 * timeline. Returns whether an entry was written. A lock per lead keeps two loads at once to one.
 */
export async function recordHomeownerView(em: EntityManager, lead: Lead): Promise<boolean> {
  return em.transactional(async (tx) => {
    await tx.execute('select pg_advisory_xact_lock(hashtextextended(?, 0))', [`lead-homeowner-view:${lead.id}`]);
    const at = now();
    const recent = await tx.count(LeadEvent, {
      company: lead.company,
      lead,
      kind: 'viewed-by-homeowner',
      at: { $gt: new Date(at.getTime() - HOMEOWNER_VIEW_QUIET_MS) },
    });
    if (recent > 0) return false;
    recordLeadEvent(tx, lead, 'viewed-by-homeowner', { at });
    return true;
  });
}
