import nodemailer, { type Transporter } from 'nodemailer';
import { config } from '../config';

export type OutgoingMail = {
  to: string;
  subject: string;
  text: string;
  html?: string;
  replyTo?: string;
  /** Display name to send under, with the configured sender's address (mail in a firm's name). */
  fromName?: string;
  /** The Message-ID header to send (kept by the outbox across attempts); nodemailer makes one otherwise. */
  messageId?: string;
  /** A calendar file: sent as the message's text/calendar part (so mail programs offer to add it) and as an .ics attachment. */
  calendar?: { method: 'REQUEST' | 'CANCEL'; filename: string; content: string };
};
export type SendMail = (message: OutgoingMail) => Promise<void>;

/**
 * The From header: the configured sender, or its address under another display name. Only the name
 * changes: mail from our own address keeps passing the receivers' sender checks (SPF, DKIM, DMARC),
 * which a firm's own domain in From would fail.
 */
export function senderFor(mailFrom: string, fromName: string | undefined): string | { name: string; address: string } {
  if (!fromName) return mailFrom;
  const address = /<([^<>]+)>\s*$/.exec(mailFrom)?.[1] ?? mailFrom.trim();
  return { name: fromName, address };
}

/** A sender for one SMTP server (smtp:// or smtps:// URL). */
export function createSmtpSender(smtpUrl: string): SendMail {
  const url = new URL(smtpUrl);
  const transporter: Transporter = nodemailer.createTransport({
    host: url.hostname,
    port: Number(url.port) || (url.protocol === 'smtps:' ? 465 : 587),
    secure: url.protocol === 'smtps:',
    auth: url.username ? { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) } : undefined,
    // Short timeouts: an unreachable SMTP server must fail fast; the outbox retries later.
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
    socketTimeout: 10_000,
    // The local stand-in offers no TLS; a real provider is reached with smtps:// or STARTTLS.
    ignoreTLS: url.protocol === 'smtp:' && url.hostname === '127.0.0.1',
  });
  return async ({ fromName, calendar, ...message }) => {
    const icalEvent = calendar ? { method: calendar.method, filename: calendar.filename, content: calendar.content } : undefined;
    await transporter.sendMail({ from: senderFor(config.mailFrom, fromName), ...message, ...(icalEvent ? { icalEvent } : {}) });
  };
}

let appSender: SendMail | undefined;

/** Sends through the configured SMTP server. */
export const sendOne: SendMail = (message) => {
  appSender ??= createSmtpSender(config.smtpUrl);
  return appSender(message);
};
