import type { Lead } from './lead.entity';

/**
 * A call logged or an e-mail sent to the homeowner: the first one sets `firstContactAt` (which ends
 * the wait the response target measures), every one moves `lastContactAt`.
 *
 * Any logged call counts, answered or not (voicemail, no answer): the firm's response time
 * measures how soon the firm answered the inquiry, and a call the homeowner missed was that answer.
 * The inquiry page says so beside the call log.
 */
export function noteContact(lead: Lead, at: Date): void {
  lead.firstContactAt ??= at;
  if (!lead.lastContactAt || lead.lastContactAt < at) lead.lastContactAt = at;
}
