import { randomBytes } from 'node:crypto';
import { createServer, type Server, type Socket } from 'node:net';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import { OutboxMail } from '../../src/lib/server/mail/outbox-mail.entity';
import { deliverDueMail, enqueueMail, retryDelayMs } from '../../src/lib/server/mail/outbox';
import { createSmtpSender, sendOne, type SendMail } from '../../src/lib/server/mail/transport';
import { freeLoopbackPort } from '../helpers/ports';
import { mailTo, waitForMail } from '../helpers/mailbox';
import { openMigratedDatabase } from '../helpers/migrated-database';

// The outbox of a database of this file's own: a delivery pass sends every due row, and other
// test files queue mail of their own at the same time.
let orm: MikroORM;
let closeDatabase: () => Promise<void>;
beforeAll(async () => {
  ({ orm, close: closeDatabase } = await openMigratedDatabase());
});
afterAll(async () => {
  await closeDatabase?.();
});

const address = () => `someone-${randomBytes(4).toString('hex')}@example.test`;

async function queue(...messages: { to: string; subject: string; text?: string }[]): Promise<OutboxMail[]> {
  const em = orm.em.fork();
  const rows = messages.map((m) => enqueueMail(em, { text: 'hello', ...m }));
  await em.flush();
  return rows;
}

const row = (id: string) => orm.em.fork().findOneOrFail(OutboxMail, id);

function deferred<T = void>() {
  let resolve!: (value: T) => void;
  const promise = new Promise<T>((r) => (resolve = r));
  return { promise, resolve };
}

describe('the mail outbox', () => {
  test('a queued message is stored with the caller’s change and then delivered over SMTP', async () => {
    const to = address();
    const em = orm.em.fork();
    const queued = enqueueMail(em, { to, subject: 'Your estimate ✓', text: 'Plain text body', html: '<p>HTML body</p>' });
    await em.flush();

    await deliverDueMail(orm.em.fork());
    const mail = await waitForMail({ to, subject: 'Your estimate' });
    expect(mail.subject).toBe('Your estimate ✓');
    expect(mail.text.trim()).toBe('Plain text body');
    expect(mail.html).toContain('<p>HTML body</p>');
    const sent = await row(queued.id);
    expect(sent.status).toBe('sent');
    expect(sent.attempts).toBe(1);
    // Source: RFC 5322 section 3.6.4: msg-id = "<" id-left "@" id-right ">".
    expect(sent.messageId).toMatch(/^<[^<>@\s]+@[^<>@\s]+>$/);
    expect(mail.messageId).toBe(sent.messageId);
  });

  test('with the SMTP server unreachable the message stays queued for a later attempt, then goes out once', async () => {
    const to = address();
    const [queued] = await queue({ to, subject: 'Retry me' });

    // A real SMTP client against a loopback port where nothing listens.
    const down = createSmtpSender(`smtp://127.0.0.1:${await freeLoopbackPort()}`);
    const before = Date.now();
    await deliverDueMail(orm.em.fork(), { send: down });
    let stored = await row(queued!.id);
    expect(stored.status).toBe('queued');
    expect(stored.attempts).toBe(1);
    expect(stored.lastError).toBeTruthy();
    expect(stored.nextAttemptAt.getTime()).toBeGreaterThanOrEqual(before + retryDelayMs(1));

    // Not yet due: a normal pass leaves it alone.
    await deliverDueMail(orm.em.fork());
    expect(await mailTo(to)).toHaveLength(0);

    // Once due, it is delivered exactly once, even by two passes at the same time.
    await orm.em.fork().nativeUpdate(OutboxMail, { id: queued!.id }, { nextAttemptAt: new Date(Date.now() - 1000) });
    await Promise.all([deliverDueMail(orm.em.fork()), deliverDueMail(orm.em.fork())]);
    await waitForMail({ to, subject: 'Retry me' });
    expect(await mailTo(to)).toHaveLength(1);
    stored = await row(queued!.id);
    expect(stored.status).toBe('sent');
    expect(stored.attempts).toBe(2);
  });

  test('a delivery cut off after the server accepted the message is retried after its claim lapses, with the same Message-ID', async () => {
    const to = address();
    const [queued] = await queue({ to, subject: 'Accepted, then the process died' });

    // The SMTP server accepts the message; then this "process" freezes for good before it can
    // record the result (as if it had been killed).
    const accepted = deferred();
    const dies: SendMail = async (message) => {
      await sendOne(message);
      accepted.resolve();
      await new Promise(() => {});
    };
    void deliverDueMail(orm.em.fork(), { send: dies });
    await accepted.promise;

    // The claim and the Message-ID were committed before the message went out.
    const claimed = await row(queued!.id);
    expect(claimed.status).toBe('sending');
    expect(claimed.attempts).toBe(1);
    expect(claimed.claimedUntil).not.toBeNull();
    const [first] = await mailTo(to);
    expect(first!.messageId).toBe(claimed.messageId);

    // While the claim holds, other passes leave the message alone.
    await deliverDueMail(orm.em.fork());
    expect(await mailTo(to)).toHaveLength(1);

    // Once the claim has lapsed (a fake clock, past the deadline), the message goes out again
    // under the same Message-ID, so the receiving side can tell it is the same message.
    const later = new Date(claimed.claimedUntil!.getTime() + 1000);
    await deliverDueMail(orm.em.fork(), { now: () => later });
    await waitForMail({ to, subject: 'process died' });
    const received = await mailTo(to);
    expect(received).toHaveLength(2);
    // Source: RFC 5322 section 3.6.4: a Message-ID names one particular message, so a receiver
    // that drops repeats by Message-ID keeps exactly one of these.
    expect(new Set(received.map((m) => m.messageId))).toEqual(new Set([claimed.messageId]));
    const done = await row(queued!.id);
    expect(done).toMatchObject({ status: 'sent', attempts: 2, messageId: claimed.messageId, claimedUntil: null });
  });

  test('messages go out four at a time, never more, so one slow message does not hold up the rest', async () => {
    const messages = Array.from({ length: 8 }, (_, i) => ({ to: address(), subject: `Batch ${i}` }));
    const rows = await queue(...messages);

    // Each send waits until four are under way at once: a serial sender would wait for ever.
    let inFlight = 0;
    let peak = 0;
    const fourUnderWay = deferred();
    const send: SendMail = async (message) => {
      inFlight += 1;
      peak = Math.max(peak, inFlight);
      if (inFlight === 4) fourUnderWay.resolve();
      try {
        await fourUnderWay.promise;
        await sendOne(message);
      } finally {
        inFlight -= 1;
      }
    };
    const result = await deliverDueMail(orm.em.fork(), { send, concurrency: 4 });
    expect(result).toMatchObject({ sent: 8, failed: 0 });
    expect(peak).toBe(4);
    for (const r of rows) expect((await row(r.id)).status).toBe('sent');
  });

  test('a frozen SMTP server costs one message its attempt, bounded by the timeout, while the others go out', async () => {
    // A server that accepts the connection and then never says a word (no greeting).
    const open = new Set<Socket>();
    const frozen: Server = createServer((socket) => {
      open.add(socket);
      socket.on('close', () => open.delete(socket));
      socket.on('error', () => {});
    });
    await new Promise<void>((resolve) => frozen.listen(0, '127.0.0.1', resolve));
    const frozenPort = (frozen.address() as { port: number }).port;
    const toFrozen = createSmtpSender(`smtp://127.0.0.1:${frozenPort}`);

    try {
      const stuck = address();
      const [stuckRow] = await queue({ to: stuck, subject: 'Stuck' });
      const others = [address(), address()];
      await queue(...others.map((to) => ({ to, subject: 'Not held up' })));

      const sentWhileFrozenWasOpen: boolean[] = [];
      const send: SendMail = async (message) => {
        if (message.to === stuck) return toFrozen(message);
        await sendOne(message);
        sentWhileFrozenWasOpen.push(open.size > 0);
      };
      const result = await deliverDueMail(orm.em.fork(), { send, timeoutMs: 3_000 });
      expect(result).toMatchObject({ sent: 2, failed: 1 });
      // The others were delivered while the frozen connection was still hanging, not after it.
      expect(sentWhileFrozenWasOpen).toEqual([true, true]);
      for (const to of others) await waitForMail({ to, subject: 'Not held up' });

      const failed = await row(stuckRow!.id);
      expect(failed.status).toBe('queued');
      expect(failed.attempts).toBe(1);
      expect(failed.lastError).toMatch(/did not answer within 3 s/);
      expect(failed.claimedUntil).toBeNull();
    } finally {
      for (const socket of open) socket.destroy();
      await new Promise((resolve) => frozen.close(resolve));
    }
  });

  test('retry delays grow and are capped at an hour', () => {
    expect([1, 2, 3, 4].map(retryDelayMs)).toEqual([15_000, 30_000, 60_000, 120_000]);
    expect(retryDelayMs(30)).toBe(3_600_000);
  });
});
