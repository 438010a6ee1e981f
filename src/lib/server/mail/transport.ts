import nodemailer, { type Transporter } from 'nodemailer';
import { config } from '../config';

export type OutgoingMail = {
  to: string;
  subject: string;
  text: string;
  html?: string;
  replyTo?: string;
  /** The Message-ID header to send (kept by the outbox across attempts); nodemailer makes one otherwise. */
  messageId?: string;
};
export type SendMail = (message: OutgoingMail) => Promise<void>;

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
  return async (message) => {
    await transporter.sendMail({ from: config.mailFrom, ...message });
  };
}

let appSender: SendMail | undefined;

/** Sends through the configured SMTP server. */
export const sendOne: SendMail = (message) => {
  appSender ??= createSmtpSender(config.smtpUrl);
  return appSender(message);
};
