import { randomUUID } from 'node:crypto';
import { LockMode, type FilterQuery } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import { config } from '../config';
import { Company } from '../companies/company.entity';
import { OutboxMail, type MailCalendar } from './outbox-mail.entity';
import { sendOne, type SendMail } from './transport';

export type MailMessage = {
  to: string;
  subject: string;
  text: string;
  html?: string;
  replyTo?: string;
  /** Sent in this name (the firm's), from our own address. */
  fromName?: string;
  companyId?: string;
  /** A calendar file (a visit's invitation) to send with it. */
  calendar?: MailCalendar;
};

/** After this many failed attempts a message is marked failed and no longer retried. */
const MAX_ATTEMPTS = 12;

/** Waits 15 s, 30 s, 1 min, 2 min … up to an hour between attempts. */
export function retryDelayMs(attempts: number): number {
  return Math.min(15_000 * 2 ** (attempts - 1), 60 * 60 * 1000);
}

/**
 * Queues a message in the outbox. It is stored by the caller's next `em.flush()` (or transaction
 * commit), together with the change that caused it; delivery happens afterwards (see
 * `deliverDueMail`; call `kickMailDelivery()` after the commit to have it go out at once).
 */
export function enqueueMail(em: EntityManager, message: MailMessage): OutboxMail {
  return em.create(OutboxMail, {
    company: message.companyId ? em.getReference(Company, message.companyId) : null,
    toAddress: message.to,
    subject: message.subject,
    textBody: message.text,
    htmlBody: message.html ?? null,
    replyTo: message.replyTo ?? null,
    fromName: message.fromName ?? null,
    calendar: message.calendar ?? null,
  });
}

export type DeliveryOptions = {
  /** Most messages one pass takes on. */
  limit?: number;
  /** Messages under way at once. */
  concurrency?: number;
  /** How long one message may take before its attempt counts as failed. */
  timeoutMs?: number;
  send?: SendMail;
  /** The clock (tests pass a later one to act after a claim has lapsed). */
  now?: () => Date;
  /** Only rows that also match this (tests running side by side deliver their own mail only). */
  only?: FilterQuery<OutboxMail>;
};

export type DeliveryResult = { sent: number; failed: number; claimed: number };

/**
 * Sends queued messages that are due, `concurrency` at a time. No transaction or lock is held
 * while SMTP talks:
 *
 * 1. Claim: a short transaction takes one due row with FOR UPDATE SKIP LOCKED, marks it `sending`
 *    until a deadline, counts the attempt and fixes its Message-ID; then commits.
 * 2. Send: outside any transaction, with the stored Message-ID, bounded by `timeoutMs`.
 * 3. Record: `sent`, or back to `queued` with a later attempt, written only while the claim is
 *    still this pass's own.
 *
 * A pass that dies between 1 and 3 leaves the row `sending`; once its deadline has passed another
 * pass sends it again with the same Message-ID. So a message goes out at least once, and a repeat
 * (only after a crash or a send that outlived its timeout) is recognisably the same message.
 */
export async function deliverDueMail(
  em: EntityManager,
  { limit = 40, concurrency = 4, timeoutMs = 20_000, send = sendOne, now = () => new Date(), only }: DeliveryOptions = {},
): Promise<DeliveryResult> {
  const result: DeliveryResult = { sent: 0, failed: 0, claimed: 0 };
  // The deadline outlasts the send's own timeout by a margin, so a live pass never loses its claim.
  const claimMs = timeoutMs + 60_000;

  let budget = limit;

  const lane = async () => {
    while (budget > 0) {
      budget -= 1;
      const claim = await claimNext(em.fork(), now(), claimMs, only);
      if (!claim) return;
      result.claimed += 1;
      const message = {
        to: claim.toAddress,
        subject: claim.subject,
        text: claim.textBody,
        html: claim.htmlBody ?? undefined,
        replyTo: claim.replyTo ?? undefined,
        fromName: claim.fromName ?? undefined,
        messageId: claim.messageId!,
        calendar: claim.calendar ?? undefined,
      };
      const outcome = await withTimeout(
        Promise.resolve().then(() => send(message)),
        timeoutMs,
      ).then(
        () => ({ ok: true as const }),
        (error: unknown) => ({ ok: false as const, error }),
      );
      await recordResult(em.fork(), claim, outcome, now());
      if (outcome.ok) result.sent += 1;
      else result.failed += 1;
    }
  };
  await Promise.all(Array.from({ length: Math.max(1, concurrency) }, lane));
  return result;
}

/** When the next queued message falls due or a claim lapses, if any is waiting. */
export async function nextMailDueAt(em: EntityManager): Promise<Date | null> {
  const [row] = await em.getConnection().execute<{ due: Date | null }[]>(
    `select least(
       (select min(next_attempt_at) from mail_outbox where status = 'queued'),
       (select min(claimed_until) from mail_outbox where status = 'sending')
     ) as due`,
  );
  return row?.due ? new Date(row.due) : null;
}

/** Takes the oldest due message (or one whose claim has lapsed) for this pass, in its own short transaction. */
async function claimNext(em: EntityManager, now: Date, claimMs: number, only?: FilterQuery<OutboxMail>): Promise<OutboxMail | null> {
  const due: FilterQuery<OutboxMail> = {
    $or: [
      { status: 'queued', nextAttemptAt: { $lte: now } },
      { status: 'sending', claimedUntil: { $lt: now } },
    ],
  };
  return em.transactional(async (tx) => {
    const [mail] = await tx.find(OutboxMail, only ? { $and: [due, only] } : due, {
      orderBy: { createdAt: 'asc' },
      limit: 1,
      lockMode: LockMode.PESSIMISTIC_PARTIAL_WRITE,
    });
    if (!mail) return null;
    mail.status = 'sending';
    mail.attempts += 1;
    mail.claimedUntil = new Date(now.getTime() + claimMs);
    mail.messageId ??= newMessageId();
    return mail;
  });
}

type SendOutcome = { ok: true } | { ok: false; error: unknown };

async function recordResult(em: EntityManager, claim: OutboxMail, outcome: SendOutcome, now: Date): Promise<void> {
  const change: Partial<OutboxMail> = outcome.ok
    ? { status: 'sent', sentAt: now, lastError: null }
    : {
        status: claim.attempts >= MAX_ATTEMPTS ? 'failed' : 'queued',
        nextAttemptAt: new Date(now.getTime() + retryDelayMs(claim.attempts)),
        lastError: outcome.error instanceof Error ? outcome.error.message.slice(0, 500) : String(outcome.error),
      };
  // Only while the claim is ours: if it lapsed and another pass took the message, that pass records it.
  await em.nativeUpdate(OutboxMail, { id: claim.id, status: 'sending', claimedUntil: claim.claimedUntil }, { ...change, claimedUntil: null });
}

/** A globally unique Message-ID on the sender's domain (RFC 5322 section 3.6.4). */
function newMessageId(): string {
  const domain = /@([^\s>]+)>?\s*$/.exec(config.mailFrom)?.[1] ?? 'lapwing.invalid';
  return `<${randomUUID()}@${domain}>`;
}

/** Resolves or rejects with the promise, or rejects once `ms` have passed; the slow send is abandoned, not stopped. */
function withTimeout(promise: Promise<void>, ms: number): Promise<void> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`The mail server did not answer within ${ms / 1000} s.`)), ms);
  });
  return Promise.race([promise, timeout]).finally(() => clearTimeout(timer));
}
