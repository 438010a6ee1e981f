import { Entity, Index, ManyToOne, Property, type Opt } from '@mikro-orm/core';
import { BaseEntity } from '../db/base.entity';
import type { Company } from '../companies/company.entity';

/**
 * queued → sending (claimed by one delivery pass until `claimedUntil`) → sent, or back to queued
 * for a later attempt, or failed after the last attempt.
 */
/** A calendar part: nodemailer sends it as text/calendar with this METHOD (RFC 5546), and as an attachment. */
export type MailCalendar = { method: 'REQUEST' | 'CANCEL'; filename: string; content: string };

export type OutboxStatus = 'queued' | 'sending' | 'sent' | 'failed';

/**
 * A message waiting to go out. Written in the same transaction as the change that caused it, so a
 * lead or an invite and its e-mail are stored together, and an SMTP outage only delays the mail.
 */
@Entity({ tableName: 'mail_outbox' })
@Index({ properties: ['status', 'nextAttemptAt'] })
export class OutboxMail extends BaseEntity {
  /** The firm the message is about, when there is one (password resets have none). */
  @ManyToOne({ entity: 'Company', nullable: true, deleteRule: 'cascade', index: true })
  company: Company | null = null;

  @Property({ type: 'string', length: 254 })
  toAddress!: string;

  @Property({ type: 'string', length: 300 })
  subject!: string;

  @Property({ type: 'text' })
  textBody!: string;

  @Property({ type: 'text', nullable: true })
  htmlBody: string | null = null;

  /** The From display name (a firm's name); the sending address stays ours. Null: the configured sender as is. */
  @Property({ type: 'string', length: 120, nullable: true })
  fromName: string | null = null;

  /** Optional Reply-To, so a homeowner's answer reaches the firm rather than the no-reply sender. */
  @Property({ type: 'string', length: 254, nullable: true })
  replyTo: string | null = null;

  /** An RFC 5545 calendar file sent with the message (a visit's invitation or cancellation). */
  @Property({ type: 'json', nullable: true })
  calendar: MailCalendar | null = null;

  @Property({ type: 'string', length: 8 })
  status: OutboxStatus & Opt = 'queued';

  @Property({ type: 'integer' })
  attempts: number & Opt = 0;

  @Property({ type: 'datetime' })
  nextAttemptAt: Date & Opt = new Date();

  @Property({ type: 'text', nullable: true })
  lastError: string | null = null;

  /**
   * The Message-ID header, chosen when the message is first claimed and kept for every attempt,
   * so a message sent again after a crash is recognisably the same message.
   */
  @Property({ type: 'string', length: 255, nullable: true })
  messageId: string | null = null;

  /** While `sending`: the pass that claimed it has until then; after that another pass may retry it. */
  @Property({ type: 'datetime', nullable: true })
  claimedUntil: Date | null = null;

  @Property({ type: 'datetime', nullable: true })
  sentAt: Date | null = null;
}
