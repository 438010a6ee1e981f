import { readFile, readdir } from 'node:fs/promises';
import path from 'node:path';
import { simpleParser } from 'mailparser';

export type ReceivedMail = {
  file: string;
  to: string[];
  /** The From header's display name and address. */
  from: { name: string; address: string };
  subject: string;
  text: string;
  html: string;
  replyTo?: string;
  messageId?: string;
  /** Every non-text part: attachments, and alternatives such as a text/calendar invitation. */
  parts: MailPart[];
};

export type MailPart = {
  /** `text/calendar`, `application/ics`, … */
  contentType: string;
  /** The Content-Type's parameters (a calendar part's `method`). */
  params: Record<string, string>;
  filename?: string;
  /** `attachment`, `inline`, or none (an alternative of the body). */
  disposition?: string;
  content: string;
};

function mailDir(): string {
  const dir = process.env.DEV_MAIL_DIR;
  if (!dir) throw new Error('DEV_MAIL_DIR is not set: run the tests with `npm test`.');
  return dir;
}

async function readAll(): Promise<ReceivedMail[]> {
  const dir = mailDir();
  const files = (await readdir(dir).catch(() => [] as string[])).filter((f) => f.endsWith('.eml')).sort();
  return Promise.all(
    files.map(async (file) => {
      const parsed = await simpleParser(await readFile(path.join(dir, file)));
      const to = (Array.isArray(parsed.to) ? parsed.to : parsed.to ? [parsed.to] : []).flatMap((a) => a.value.map((v) => v.address?.toLowerCase() ?? ''));
      return {
        file,
        to,
        from: { name: parsed.from?.value[0]?.name ?? '', address: parsed.from?.value[0]?.address ?? '' },
        subject: parsed.subject ?? '',
        text: parsed.text ?? '',
        html: typeof parsed.html === 'string' ? parsed.html : '',
        replyTo: parsed.replyTo?.value[0]?.address,
        messageId: parsed.messageId,
        parts: parsed.attachments.map((a) => {
          const type = a.headers.get('content-type') as { value?: string; params?: Record<string, string> } | undefined;
          return {
            contentType: a.contentType,
            params: type?.params ?? {},
            filename: a.filename,
            disposition: a.contentDisposition,
            content: a.content.toString('utf8'),
          };
        }),
      };
    }),
  );
}

/** Every message the SMTP stand-in has received for an address, oldest first. */
export async function mailTo(address: string): Promise<ReceivedMail[]> {
  return (await readAll()).filter((m) => m.to.includes(address.toLowerCase()));
}

/** Waits until a message for `to` (and matching `subject`, if given) has arrived at the SMTP stand-in. */
export async function waitForMail({ to, subject, timeoutMs = 10_000 }: { to: string; subject?: string | RegExp; timeoutMs?: number }): Promise<ReceivedMail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = (await mailTo(to)).find(
      (m) => subject === undefined || (typeof subject === 'string' ? m.subject.includes(subject) : subject.test(m.subject)),
    );
    if (found) return found;
    if (Date.now() > deadline) throw new Error(`No e-mail to ${to}${subject ? ` with subject ${subject}` : ''} within ${timeoutMs} ms`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}
