import type { EntityManager } from '@mikro-orm/postgresql';
import { fillPlaceholders, type PlaceholderValues } from '~/lib/shared/mail-placeholders';
import { now } from '../clock';
import { estimateSnapshot } from '../estimates/estimate-snapshot';
import { enqueueMail } from '../mail/outbox';
import { User } from '../users/user.entity';
import { noteContact } from './contact-times';
import { recordLeadEvent } from './lead-events';
import type { LeadEvent } from './lead-event.entity';
import { escapeHtml, firmReplyTo } from './lead-mail';
import { leadOfCompany } from './lead.repository';
import { leadViewUrl } from './lead.service';
import type { Lead } from './lead.entity';
import { mintViewKey } from './lead-view-keys';
import { templateOfFirm } from './mail-templates';

/** What the kept copy of an e-mail shows where the private link was. */
export const KEPT_LINK_TEXT = '[private link to the estimate]';

export type LeadEmail = { companyId: string; leadId: string; senderUserId: string; templateId?: string | null; subject: string; body: string };

/** Everything a template can say about this inquiry except the estimate link, which exists only once sent. */
export function placeholderValues(lead: Lead, senderName: string): Omit<PlaceholderValues, 'estimate_link'> {
  return {
    name: lead.name,
    firm: lead.company.name,
    reference: lead.reference,
    range: estimateSnapshot.read(lead.estimate).price.rangeText,
    sender: senderName,
    firm_phone: lead.company.phone ?? '',
  };
}

/** The HTML version of a plain-text message: paragraphs as typed, links clickable, everything escaped. */
export function messageHtml(text: string): string {
  const paragraphs = text
    .split(/\n{2,}/)
    .map((p) =>
      escapeHtml(p)
        .replace(/https?:\/\/[^\s<]+/g, (url) => `<a href="${url}" style="color:#2F6B4F">${url}</a>`)
        .replace(/\n/g, '<br>'),
    )
    .map((p) => `<p>${p}</p>`)
    .join('\n');
  return `<div style="font-family:'DM Sans',Arial,sans-serif;color:#1F2A2E;max-width:560px">\n${paragraphs}\n</div>`;
}

/**
 * Sends the homeowner an e-mail from the inquiry page, through the outbox in the same transaction
 * as its timeline entry (call `kickMailDelivery()` after the commit). It goes in the firm's name,
 * Reply-To the firm. `{estimate_link}` becomes a link with a key minted for this e-mail; the
 * confirmation's link keeps working. Counts as contact.
 *
 * Timeline entry `email-sent`, data:
 * `{ subject, to, template?: template name, mailId: outbox row id, body: the text as sent, the link's key left out }`.
 */
export async function sendLeadEmail(em: EntityManager, input: LeadEmail): Promise<LeadEvent> {
  return em.transactional(async (tx) => {
    const lead = await leadOfCompany(tx, input.companyId, input.leadId);
    const template = input.templateId ? await templateOfFirm(tx, input.companyId, input.templateId) : null;
    const sender = await tx.findOneOrFail(User, { id: input.senderUserId });
    const values: PlaceholderValues = { ...placeholderValues(lead, sender.name), estimate_link: leadViewUrl(lead.id, mintViewKey(tx, lead)) };
    const subject = fillPlaceholders(input.subject, values).replace(/\s+/g, ' ').trim();
    const body = fillPlaceholders(input.body, values);
    const company = lead.company;
    const mail = enqueueMail(tx, {
      to: lead.email,
      subject,
      text: body,
      html: messageHtml(body),
      companyId: company.id,
      fromName: company.name,
      replyTo: firmReplyTo(company),
    });
    const at = now();
    await noteContact(tx, lead, at);
    // Kept without the link's key: the database holds keys only as hashes.
    const kept = fillPlaceholders(input.body, { ...values, estimate_link: KEPT_LINK_TEXT });
    const data: Record<string, unknown> = { subject, to: lead.email, mailId: mail.id, body: kept };
    if (template) data.template = template.name;
    const event = recordLeadEvent(tx, lead, 'email-sent', { actorUserId: input.senderUserId, at, data });
    await tx.flush();
    return event;
  });
}
