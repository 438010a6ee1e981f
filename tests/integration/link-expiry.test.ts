import { afterAll, afterEach, beforeAll, describe, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import { getOrm } from '../../src/lib/server/boot/orm';
import { afterResponseSettled } from '../../src/lib/server/after-response';
import { completePasswordReset, readPasswordReset, requestPasswordReset, RESET_PROBLEMS } from '../../src/lib/server/auth/password-reset';
import { OutboxMail } from '../../src/lib/server/mail/outbox-mail.entity';
import { acceptInvite, LINK_PROBLEMS, readInvite } from '../../src/lib/server/team/invite-acceptance';
import { inviteToTeam, listTeam } from '../../src/lib/server/team/team.service';
import { Membership } from '../../src/lib/server/users/membership.entity';
import { buildFirm, linkToken } from '../helpers/accounts';
import { DAY_MS, HOUR_MS, MINUTE_MS, useFakeClock } from '../helpers/fake-clock';

let orm: MikroORM;
beforeAll(async () => {
  orm = await getOrm();
});
afterAll(async () => {
  await orm.close();
});
const em = () => orm.em.fork();
const anAddress = () => `203.0.113.${Math.floor(Math.random() * 250) + 1}-${Math.random()}`;

let restore: (() => void) | undefined;
afterEach(() => {
  restore?.();
  restore = undefined;
});
function clockAt(start: string) {
  const clock = useFakeClock(start);
  restore = clock.restore;
  return clock;
}

async function queuedMailTo(address: string): Promise<OutboxMail> {
  return em().findOneOrFail(OutboxMail, { toAddress: address }, { orderBy: { createdAt: 'desc' } });
}

describe('links expire by the server’s clock', () => {
  test('an invitation works for a week by the clock, and not a minute longer', async () => {
    // Sent at 9:00 AM CST on 2026-03-05; the clocks go forward on 2026-03-08, so a week of 168
    // hours ends at 10:00 AM CDT. Source: IANA tz database, northamerica: Rule US 2007 max Mar Sun>=8 2:00.
    const clock = clockAt('2026-03-05T15:00:00Z');
    const { company, members, tag } = await buildFirm(em(), [{ name: 'Nell', role: 'owner' }], { timeZone: 'America/Chicago' });
    const email = `week-${tag}@firm.test`;
    await inviteToTeam(em(), { companyId: company.id, invitedById: members[0]!.user.id, email, role: 'sales' });
    const mail = await queuedMailTo(email);
    expect(mail.textBody).toContain('expires on Thu, Mar 12, 2026, 10:00 AM CDT.');
    const token = linkToken(mail.textBody, 'invite');

    clock.advance(7 * DAY_MS - MINUTE_MS);
    expect(await readInvite(em(), token)).toMatchObject({ state: 'open' });
    expect((await listTeam(em(), company.id)).invites.map((i) => i.email)).toEqual([email]);

    clock.advance(MINUTE_MS);
    expect(await readInvite(em(), token)).toEqual({ state: 'expired' });
    expect((await listTeam(em(), company.id)).invites).toEqual([]);
    await expect(acceptInvite(em(), token, { name: 'Late', password: 'a long enough password' })).rejects.toThrow(LINK_PROBLEMS.expired);
  });

  test('a reset link works for an hour by the clock; its e-mail gives the person’s firm’s local time', async () => {
    const clock = clockAt('2026-12-02T01:19:00Z');
    const { members } = await buildFirm(em(), [{ name: 'Ivo', role: 'sales' }], { timeZone: 'America/Chicago' });
    const ivo = members[0]!;
    await requestPasswordReset(em(), { email: ivo.email, address: anAddress() });
    await afterResponseSettled();
    const mail = await queuedMailTo(ivo.email);
    // Source: IANA tz database, northamerica: CST is UTC-6, so 02:19 UTC is 8:19 PM the evening before.
    expect(mail.textBody).toContain('expires on Tue, Dec 1, 2026, 8:19 PM CST.');
    const token = linkToken(mail.textBody, 'reset');

    clock.advance(HOUR_MS - MINUTE_MS);
    expect(await readPasswordReset(em(), token)).toBe('open');
    clock.advance(MINUTE_MS);
    expect(await readPasswordReset(em(), token)).toBe('expired');
    await expect(completePasswordReset(em(), token, 'a long new password')).rejects.toThrow(RESET_PROBLEMS.expired);
  });

  test('someone in two firms that keep different time gets the reset expiry in UTC, labelled so', async () => {
    clockAt('2026-12-02T01:19:00Z');
    const chicago = await buildFirm(em(), [{ name: 'Uri', role: 'owner' }], { timeZone: 'America/Chicago' });
    const berlin = await buildFirm(em(), [], { timeZone: 'Europe/Berlin' });
    const uri = chicago.members[0]!;
    const setup = em();
    setup.create(Membership, { company: berlin.company.id, user: uri.user.id, role: 'sales' });
    await setup.flush();
    await requestPasswordReset(em(), { email: uri.email, address: anAddress() });
    await afterResponseSettled();
    expect((await queuedMailTo(uri.email)).textBody).toContain('expires on Wed, Dec 2, 2026, 2:19 AM UTC.');
  });
});
