import type { EntityManager } from '@mikro-orm/postgresql';
import { mentionedIn } from '~/lib/shared/mentions';
import { now } from '../clock';
import { enqueueMail } from '../mail/outbox';
import { firmPeople } from './firm-people';
import { escapeHtml } from './lead-mail';
import { recordLeadEvent } from './lead-events';
import type { LeadEvent } from './lead-event.entity';
import { leadOfCompany } from './lead.repository';
import { staffLeadUrl } from './lead.service';

export type NewNote = { companyId: string; leadId: string; authorUserId: string; text: string };

/** The e-mail a teammate gets when a note mentions them. */
export function mentionMail(input: { writer: string; reference: string; homeowner: string; text: string; url: string }) {
  const subject = `${input.writer} mentioned you on inquiry ${input.reference}`;
  const text = [
    `${input.writer} mentioned you in a note on ${input.homeowner}'s inquiry ${input.reference}:`,
    '',
    input.text,
    '',
    `Open the inquiry: ${input.url}`,
  ].join('\n');
  const html = `<div style="font-family:'DM Sans',Arial,sans-serif;color:#1F2A2E">
<p>${escapeHtml(input.writer)} mentioned you in a note on ${escapeHtml(input.homeowner)}'s inquiry <strong>${escapeHtml(input.reference)}</strong>:</p>
<blockquote style="white-space:pre-wrap;border-left:3px solid #DCC59A;margin:0;padding-left:12px">${escapeHtml(input.text)}</blockquote>
<p><a href="${escapeHtml(input.url)}" style="color:#2F6B4F">Open the inquiry</a></p>
</div>`;
  return { subject, text, html };
}

/**
 * Adds a note to an inquiry's timeline. Mentions are read from the text against the firm's own
 * members only; each one mentioned (not the writer) gets an e-mail with a link to the inquiry,
 * queued in the same transaction as the note (call `kickMailDelivery()` after).
 *
 * Timeline entry `note`, data: `{ text: string, mentions: { userId, name }[] }`.
 */
export async function addNote(em: EntityManager, input: NewNote): Promise<{ event: LeadEvent; mailed: number }> {
  return em.transactional(async (tx) => {
    const lead = await leadOfCompany(tx, input.companyId, input.leadId);
    const people = await firmPeople(tx, input.companyId);
    const mentions = mentionedIn(input.text, people).map(({ userId, name }) => ({ userId, name }));
    const writer = people.find((p) => p.userId === input.authorUserId)?.name ?? 'A teammate';
    const event = recordLeadEvent(tx, lead, 'note', { actorUserId: input.authorUserId, at: now(), data: { text: input.text, mentions } });
    let mailed = 0;
    for (const mention of mentions) {
      if (mention.userId === input.authorUserId) continue;
      const person = people.find((p) => p.userId === mention.userId)!;
      const mail = mentionMail({ writer, reference: lead.reference, homeowner: lead.name, text: input.text, url: staffLeadUrl(lead.id) });
      enqueueMail(tx, { to: person.email, ...mail, companyId: input.companyId });
      mailed++;
    }
    await tx.flush();
    return { event, mailed };
  });
}
