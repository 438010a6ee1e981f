import type { EntityManager } from '@mikro-orm/postgresql';
import type { Lead } from './lead.entity';
import { refreshTriageScore } from './triage';

/**
 * A call logged or an e-mail sent to the homeowner: the first one sets `firstContactAt` (which ends
 * the wait the response target measures), every one moves `lastContactAt`.
 *
 * Any logged call counts, answered or not (voicemail, no answer): the firm's response time
 * measures how soon the firm answered the inquiry, and a call the homeowner missed was that answer.
 * The inquiry page says so beside the call log. The triage score's "response so far" reason
 * depends on the first contact, so the stored score is worked out again with it.
 */
export async function noteContact(em: EntityManager, lead: Lead, at: Date): Promise<void> {
  const first = !lead.firstContactAt;
  lead.firstContactAt ??= at;
  if (!lead.lastContactAt || lead.lastContactAt < at) lead.lastContactAt = at;
  if (first) await refreshTriageScore(em, lead, at);
}
