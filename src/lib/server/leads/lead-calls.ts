import type { EntityManager } from '@mikro-orm/postgresql';
import type { CallOutcome } from '~/lib/shared/inquiry-work-schemas';
import { now } from '../clock';
import { noteContact } from './contact-times';
import { recordLeadEvent } from './lead-events';
import type { LeadEvent } from './lead-event.entity';
import { leadOfCompany } from './lead.repository';

export type LoggedCall = { companyId: string; leadId: string; callerUserId: string; outcome: CallOutcome; note?: string };

/**
 * Logs a call to the homeowner. Every outcome counts as contact (see `noteContact` for why an
 * unanswered call counts toward the response time too).
 *
 * Timeline entry `call`, data: `{ outcome: 'reached' | 'voicemail' | 'no-answer', note?: string }`.
 */
export async function logCall(em: EntityManager, input: LoggedCall): Promise<LeadEvent> {
  return em.transactional(async (tx) => {
    const lead = await leadOfCompany(tx, input.companyId, input.leadId);
    const at = now();
    await noteContact(tx, lead, at);
    const data: Record<string, unknown> = { outcome: input.outcome };
    if (input.note) data.note = input.note;
    const event = recordLeadEvent(tx, lead, 'call', { actorUserId: input.callerUserId, at, data });
    await tx.flush();
    return event;
  });
}
