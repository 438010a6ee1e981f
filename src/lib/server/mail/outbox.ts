import { LockMode, type FilterQuery } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import { Company } from '../companies/company.entity';
import { OutboxMail } from './outbox-mail.entity';
import { sendOne, type SendMail } from './transport';

export type MailMessage = {
  to: string;
  subject: string;
  text: string;
  html?: string;
  replyTo?: string;
  companyId?: string;
};

/** After this many failed attempts a message is marked failed and no longer retried. */
const MAX_ATTEMPTS = 12;

/** Waits 15 s, 30 s, 1 min, 2 min … up to an hour between attempts. */
export function retryDelayMs(attempts: number): number {
  return Math.min(15_000 * 2 ** (attempts - 1), 60 * 60 * 1000);
}

/**
 * Queues a message in the outbox. It is stored by the caller's next `em.flush()` (or transaction
 * commit), together with the change that caused it; delivery happens afterwards.
 */
export function enqueueMail(em: EntityManager, message: MailMessage): OutboxMail {
  return em.create(OutboxMail, {
    company: message.companyId ? em.getReference(Company, message.companyId) : null,
    toAddress: message.to,
    subject: message.subject,
    textBody: message.text,
    htmlBody: message.html ?? null,
    replyTo: message.replyTo ?? null,
  });
}

/**
 * Sends every queued message that is due. Rows are claimed with FOR UPDATE SKIP LOCKED, so several
 * app processes can run this at once without sending a message twice. `only` narrows a pass to some
 * rows (tests deliver just their own mail: their files share one database and run in parallel).
 */
export async function deliverDueMail(
  em: EntityManager,
  { limit = 25, send = sendOne, only }: { limit?: number; send?: SendMail; only?: FilterQuery<OutboxMail> } = {},
): Promise<{ sent: number; failed: number }> {
  let sent = 0;
  let failed = 0;
  await em.fork().transactional(async (tx) => {
    const due = await tx.find(
      OutboxMail,
      { $and: [{ status: 'queued', nextAttemptAt: { $lte: new Date() } }, only ?? {}] },
      { orderBy: { createdAt: 'asc' }, limit, lockMode: LockMode.PESSIMISTIC_PARTIAL_WRITE },
    );
    for (const mail of due) {
      mail.attempts += 1;
      try {
        await send({ to: mail.toAddress, subject: mail.subject, text: mail.textBody, html: mail.htmlBody ?? undefined, replyTo: mail.replyTo ?? undefined });
        mail.status = 'sent';
        mail.sentAt = new Date();
        mail.lastError = null;
        sent++;
      } catch (error) {
        mail.lastError = error instanceof Error ? error.message.slice(0, 500) : String(error);
        if (mail.attempts >= MAX_ATTEMPTS) mail.status = 'failed';
        else mail.nextAttemptAt = new Date(Date.now() + retryDelayMs(mail.attempts));
        failed++;
      }
    }
  });
  return { sent, failed };
}
