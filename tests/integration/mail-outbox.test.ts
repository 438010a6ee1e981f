import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import { getOrm } from '../../src/lib/server/boot/orm';
import { OutboxMail } from '../../src/lib/server/mail/outbox-mail.entity';
import { enqueueMail, retryDelayMs } from '../../src/lib/server/mail/outbox';
import { createSmtpSender } from '../../src/lib/server/mail/transport';
import { freeLoopbackPort } from '../helpers/ports';
import { mailTo, waitForMail } from '../helpers/mailbox';
import { deliverMailTo } from '../helpers/outbox';

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

    await deliverMailTo(orm.em.fork(), to);
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
    await deliverMailTo(orm.em.fork(), to, { send: down });
    let row = await orm.em.fork().findOneOrFail(OutboxMail, queued.id);
    expect(row.status).toBe('queued');
    expect(row.attempts).toBe(1);
    expect(row.lastError).toBeTruthy();
    expect(row.nextAttemptAt.getTime()).toBeGreaterThanOrEqual(before + retryDelayMs(1));

    // Not yet due: a normal pass leaves it alone.
    expect(await deliverMailTo(orm.em.fork(), to)).toEqual({ sent: 0, failed: 0 });
    expect(await mailTo(to)).toHaveLength(0);

    // Once due, two passes at once deliver it exactly once: the row lock lets one pass send it.
    await orm.em.fork().nativeUpdate(OutboxMail, { id: queued.id }, { nextAttemptAt: new Date(Date.now() - 1000) });
    const passes = await Promise.all([deliverMailTo(orm.em.fork(), to), deliverMailTo(orm.em.fork(), to)]);
    expect(passes.map((pass) => pass.sent).sort()).toEqual([0, 1]);
    await waitForMail({ to, subject: 'Retry me' });
    expect(await mailTo(to)).toHaveLength(1);
    row = await orm.em.fork().findOneOrFail(OutboxMail, queued.id);
    expect(row.status).toBe('sent');
    expect(row.attempts).toBe(2);
  });

  test('a pass limited to some recipients leaves everyone else’s due mail queued and untouched', async () => {
    const mine = address();
    const theirs = address();
    const em = orm.em.fork();
    const ownRow = enqueueMail(em, { to: mine, subject: 'Mine', text: 'for this test' });
    const otherRow = enqueueMail(em, { to: theirs, subject: 'Theirs', text: 'for another test file' });
    await em.flush();

    expect(await deliverMailTo(orm.em.fork(), mine)).toEqual({ sent: 1, failed: 0 });
    expect((await orm.em.fork().findOneOrFail(OutboxMail, ownRow.id)).status).toBe('sent');
    const other = await orm.em.fork().findOneOrFail(OutboxMail, otherRow.id);
    expect(other).toMatchObject({ status: 'queued', attempts: 0, sentAt: null });
    await orm.em.fork().nativeDelete(OutboxMail, { id: otherRow.id });
  });

  test('retry delays grow and are capped at an hour', () => {
    expect([1, 2, 3, 4].map(retryDelayMs)).toEqual([15_000, 30_000, 60_000, 120_000]);
    expect(retryDelayMs(30)).toBe(3_600_000);
  });
});
