import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import { getOrm } from '../../src/lib/server/boot/orm';
import { OutboxMail } from '../../src/lib/server/mail/outbox-mail.entity';
import { deliverDueMail, enqueueMail, retryDelayMs } from '../../src/lib/server/mail/outbox';
import { createSmtpSender } from '../../src/lib/server/mail/transport';
import { freeLoopbackPort } from '../helpers/ports';
import { mailTo, waitForMail } from '../helpers/mailbox';

let orm: MikroORM;
beforeAll(async () => {
  orm = await getOrm();
});
afterAll(async () => {
  await orm.close();
});

const address = () => `someone-${randomBytes(4).toString('hex')}@example.test`;

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
    const row = await orm.em.fork().findOneOrFail(OutboxMail, queued.id);
    expect(row.status).toBe('sent');
    expect(row.attempts).toBe(1);
  });

  test('with the SMTP server unreachable the message stays queued for a later attempt, then goes out once', async () => {
    const to = address();
    const em = orm.em.fork();
    const queued = enqueueMail(em, { to, subject: 'Retry me', text: 'hello' });
    await em.flush();

    // A real SMTP client against a loopback port where nothing listens.
    const down = createSmtpSender(`smtp://127.0.0.1:${await freeLoopbackPort()}`);
    const before = Date.now();
    await deliverDueMail(orm.em.fork(), { send: down });
    let row = await orm.em.fork().findOneOrFail(OutboxMail, queued.id);
    expect(row.status).toBe('queued');
    expect(row.attempts).toBe(1);
    expect(row.lastError).toBeTruthy();
    expect(row.nextAttemptAt.getTime()).toBeGreaterThanOrEqual(before + retryDelayMs(1));

    // Not yet due: a normal pass leaves it alone.
    await deliverDueMail(orm.em.fork());
    expect(await mailTo(to)).toHaveLength(0);

    // Once due, it is delivered exactly once.
    await orm.em.fork().nativeUpdate(OutboxMail, { id: queued.id }, { nextAttemptAt: new Date(Date.now() - 1000) });
    await Promise.all([deliverDueMail(orm.em.fork()), deliverDueMail(orm.em.fork())]);
    await waitForMail({ to, subject: 'Retry me' });
    await new Promise((resolve) => setTimeout(resolve, 300));
    expect(await mailTo(to)).toHaveLength(1);
    row = await orm.em.fork().findOneOrFail(OutboxMail, queued.id);
    expect(row.status).toBe('sent');
    expect(row.attempts).toBe(2);
  });

  test('retry delays grow and are capped at an hour', () => {
    expect([1, 2, 3, 4].map(retryDelayMs)).toEqual([15_000, 30_000, 60_000, 120_000]);
    expect(retryDelayMs(30)).toBe(3_600_000);
  });
});
