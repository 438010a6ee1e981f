import { afterAll, beforeAll, describe, expect, test, vi } from 'vitest';
import pg from 'pg';
import type { MikroORM } from '@mikro-orm/postgresql';
import { getOrm } from '../../src/lib/server/boot/orm';
import { User } from '../../src/lib/server/users/user.entity';
import { Membership } from '../../src/lib/server/users/membership.entity';
import { hashPassword, verifyPassword } from '../../src/lib/server/users/password';
import { Session } from '../../src/lib/server/auth/session.entity';
import { Invite } from '../../src/lib/server/team/invite.entity';
import { PasswordReset } from '../../src/lib/server/auth/password-reset.entity';
import { getLucia } from '../../src/lib/server/auth/lucia';
import { startSession } from '../../src/lib/server/auth/sessions';
import { checkSignIn } from '../../src/lib/server/auth/sign-in';
import { changePassword } from '../../src/lib/server/auth/password-change';
import { completePasswordReset, readPasswordReset, requestPasswordReset, RESET_PROBLEMS } from '../../src/lib/server/auth/password-reset';
import { sessionTokenDigest } from '../../src/lib/server/auth/tokens';
import { acceptInvite, LINK_PROBLEMS, readInvite } from '../../src/lib/server/team/invite-acceptance';
import { changeRole, inviteToTeam, listTeam, removeMember } from '../../src/lib/server/team/team.service';
import { Conflict, InvalidInput, NotFound, TooManyRequests } from '../../src/lib/server/errors';
import { ACCOUNT_LIMIT, slowDown } from '../../src/lib/server/auth/sign-in-throttle';
import { afterResponseSettled } from '../../src/lib/server/after-response';
import { mailTo, waitForMail } from '../helpers/mailbox';
import { deliverMailTo } from '../helpers/outbox';
import { buildFirm, linkToken } from '../helpers/accounts';

let orm: MikroORM;
beforeAll(async () => {
  orm = await getOrm();
});
afterAll(async () => {
  await orm.close();
});
const em = () => orm.em.fork();
const anAddress = () => `198.51.100.${Math.floor(Math.random() * 250) + 1}-${Math.random()}`;

describe('passwords', () => {
  test('are stored as argon2id at no less than the OWASP minimum, and hashing takes tens of milliseconds', async () => {
    const started = performance.now();
    const hash = await hashPassword('correct horse battery staple');
    const hashMs = performance.now() - started;
    // Source: OWASP Password Storage Cheat Sheet, argon2id minimum m=19456 KiB, t=2, p=1.
    expect(hash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
    const verifyStarted = performance.now();
    expect(await verifyPassword(hash, 'correct horse battery staple')).toBe(true);
    const verifyMs = performance.now() - verifyStarted;
    console.info(`argon2id hash ${hashMs.toFixed(0)} ms, verify ${verifyMs.toFixed(0)} ms`);
    expect(await verifyPassword(hash, 'correct horse battery stapler')).toBe(false);
  });
});

describe('sessions', () => {
  test('a session is found by its token, and the database holds only the token’s digest', async () => {
    const { members, company } = await buildFirm(em(), [{ name: 'Ida', role: 'owner' }]);
    const { token } = await startSession(members[0].user.id, company.id);
    const row = await em().findOneOrFail(Session, { user: members[0].user.id });
    expect(row.tokenDigest).toBe(sessionTokenDigest(token));
    expect(row.tokenDigest).not.toContain(token);
    // Source: the Copenhagen Book, "Server-side tokens": at least 112 bits; Lucia uses 25 bytes = 200 bits in 40 base32 characters.
    expect(token).toMatch(/^[a-z2-7]{40}$/);
    const { session, user } = await getLucia().validateSession(token);
    expect(user?.email).toBe(members[0].email);
    expect(session?.companyId).toBe(company.id);
  });

  test('a session extends on use but never past its absolute end, and ends at that end however active', async () => {
    const { members, company } = await buildFirm(em(), [{ name: 'Jon', role: 'owner' }]);
    const { token } = await startSession(members[0].user.id, company.id);
    const digest = sessionTokenDigest(token);
    const soon = new Date(Date.now() + 60_000);
    const later = new Date(Date.now() + 10 * 60_000);
    // Used with little idle time left: extended, but only up to the absolute end.
    await em().nativeUpdate(Session, { tokenDigest: digest }, { expiresAt: soon, absoluteExpiresAt: later });
    const used = await getLucia().validateSession(token);
    expect(used.session?.fresh).toBe(true);
    const row = await em().findOneOrFail(Session, { tokenDigest: digest });
    expect(Math.abs(row.expiresAt.getTime() - later.getTime())).toBeLessThan(1000);
    // Past the absolute end: gone, even though it was just used.
    await em().nativeUpdate(Session, { tokenDigest: digest }, { expiresAt: later, absoluteExpiresAt: new Date(Date.now() - 1000) });
    expect((await getLucia().validateSession(token)).session).toBeNull();
    expect(await em().count(Session, { tokenDigest: digest })).toBe(0);
  });

  test('an idle session expires', async () => {
    const { members, company } = await buildFirm(em(), [{ name: 'Kit', role: 'owner' }]);
    const { token } = await startSession(members[0].user.id, company.id);
    await em().nativeUpdate(Session, { tokenDigest: sessionTokenDigest(token) }, { expiresAt: new Date(Date.now() - 1000) });
    expect((await getLucia().validateSession(token)).session).toBeNull();
  });

  test('changing the password ends the person’s other sessions and keeps the current one', async () => {
    const { members, company } = await buildFirm(em(), [{ name: 'Lea', role: 'sales' }]);
    const [lea] = members;
    const here = await startSession(lea.user.id, company.id);
    const elsewhere = await startSession(lea.user.id, company.id);
    await expect(
      changePassword(em(), {
        userId: lea.user.id,
        currentPassword: 'wrong password here',
        newPassword: 'a brand new password',
        keepSessionToken: here.token,
        address: anAddress(),
      }),
    ).rejects.toMatchObject({ fields: { currentPassword: 'That is not your current password.' } });
    const result = await changePassword(em(), {
      userId: lea.user.id,
      currentPassword: lea.password,
      newPassword: 'a brand new password',
      keepSessionToken: here.token,
      address: anAddress(),
    });
    expect(result.endedSessions).toBe(1);
    expect((await getLucia().validateSession(here.token)).session).not.toBeNull();
    expect((await getLucia().validateSession(elsewhere.token)).session).toBeNull();
  });
});

describe('sign-in', () => {
  test('a right password signs in to the firm; a wrong one and an unknown address get the same answer', async () => {
    const { members, company } = await buildFirm(em(), [{ name: 'Mo', role: 'owner' }]);
    const address = anAddress();
    expect(await checkSignIn(em(), { email: members[0].email, password: members[0].password, address })).toEqual({
      userId: members[0].user.id,
      companyId: company.id,
    });
    const wrong = await checkSignIn(em(), { email: members[0].email, password: 'not the password', address }).catch((e) => e);
    const unknown = await checkSignIn(em(), { email: 'nobody-here@firm.test', password: 'not the password', address }).catch((e) => e);
    expect(wrong).toBeInstanceOf(InvalidInput);
    expect(unknown).toBeInstanceOf(InvalidInput);
    expect(unknown.message).toBe(wrong.message);
  });

  test('after 10 failures for one account, each slowed more than the last, it is refused for a while with a clear message, even with the right password', async () => {
    const { members } = await buildFirm(em(), [{ name: 'Ned', role: 'owner' }]);
    const [ned] = members;
    // The waits the throttle asks for, seen without spending them (a fake clock for this one wait).
    const waits = vi.spyOn(slowDown, 'wait').mockResolvedValue(undefined);
    let refusal: unknown;
    try {
      for (let attempt = 1; attempt <= ACCOUNT_LIMIT.points; attempt++) {
        // A different address each time: the account counter alone must stop this.
        refusal = await checkSignIn(em(), { email: ned.email, password: `wrong guess ${attempt}`, address: anAddress() }).catch((e) => e);
      }
      // Slowed: from the 4th attempt on (3 failures before it), 250 ms more each time. common practice, no source.
      expect(waits.mock.calls.map(([ms]) => ms)).toEqual([250, 500, 750, 1000, 1250, 1500, 1750]);
    } finally {
      waits.mockRestore();
    }
    expect(refusal).toBeInstanceOf(InvalidInput);
    const right = await checkSignIn(em(), { email: ned.email, password: ned.password, address: anAddress() }).catch((e) => e);
    expect(right).toBeInstanceOf(TooManyRequests);
    expect(right.message).toMatch(/Too many failed sign-ins for this account\. Try again in 15 minutes/);
    expect(Number(right.headers['Retry-After'])).toBeGreaterThan(60);
  });

  test('repeated failures from one address are refused for every account tried from there', async () => {
    const address = anAddress();
    for (let i = 0; i < 50; i++) {
      await checkSignIn(em(), { email: `guess-${i}@firm.test`, password: 'wrong guess', address }).catch(() => undefined);
    }
    const { members } = await buildFirm(em(), [{ name: 'Oda', role: 'owner' }]);
    const refused = await checkSignIn(em(), { email: members[0].email, password: members[0].password, address }).catch((e) => e);
    expect(refused).toBeInstanceOf(TooManyRequests);
    expect(refused.message).toMatch(/from your network/);
    // The same person from another address still gets in: the address limit cannot lock them out.
    expect(await checkSignIn(em(), { email: members[0].email, password: members[0].password, address: anAddress() })).toMatchObject({
      userId: members[0].user.id,
    });
  }, 60_000);
});

describe('team', () => {
  test('the owner invites a new person, who sets a password from the e-mailed link, once', async () => {
    const { members, company, tag } = await buildFirm(em(), [{ name: 'Pia', role: 'owner' }]);
    const email = `newcomer-${tag}@firm.test`;
    await inviteToTeam(em(), { companyId: company.id, invitedById: members[0].user.id, email, role: 'sales' });
    await deliverMailTo(em(), email);
    const mail = await waitForMail({ to: email, subject: `Join ${company.name}` });
    expect(mail.text).toContain('Pia has invited you');
    const token = linkToken(mail.text, 'invite');
    // The link's token is not in the database; only its keyed digest is.
    expect(await em().count(Invite, { tokenDigest: token })).toBe(0);

    expect(await readInvite(em(), token)).toMatchObject({ state: 'open', email, role: 'sales', hasAccount: false, firmName: company.name });
    expect(await acceptInvite(em(), token, { name: 'Newcomer', password: 'a newcomer password' })).toMatchObject({ companyId: company.id });
    const user = await em().findOneOrFail(User, { email }, { populate: ['passwordHash'] });
    expect(user.passwordHash).toMatch(/^\$argon2id\$/);
    expect(await em().count(Membership, { user, company, role: 'sales' })).toBe(1);

    expect(await readInvite(em(), token)).toEqual({ state: 'used' });
    const reused = await acceptInvite(em(), token, { name: 'Someone Else', password: 'another long password' }).catch((e) => e);
    expect(reused).toBeInstanceOf(InvalidInput);
    expect(reused.message).toBe(LINK_PROBLEMS.used);
  });

  test('an expired invitation cannot be used, and a made-up token is refused', async () => {
    const { members, company, tag } = await buildFirm(em(), [{ name: 'Quin', role: 'owner' }]);
    const email = `late-${tag}@firm.test`;
    const invite = await inviteToTeam(em(), { companyId: company.id, invitedById: members[0].user.id, email, role: 'owner' });
    await deliverMailTo(em(), email);
    const token = linkToken((await waitForMail({ to: email })).text, 'invite');
    await em().nativeUpdate(Invite, { id: invite.id }, { expiresAt: new Date(Date.now() - 1000) });
    expect(await readInvite(em(), token)).toEqual({ state: 'expired' });
    await expect(acceptInvite(em(), token, { name: 'Late', password: 'a long enough password' })).rejects.toThrow(LINK_PROBLEMS.expired);
    expect(await readInvite(em(), 'A'.repeat(27))).toEqual({ state: 'unknown' });
    expect(await readInvite(em(), '../../etc/passwd')).toEqual({ state: 'unknown' });
  });

  test('someone who already signs in elsewhere joins a second firm with their own password', async () => {
    const first = await buildFirm(em(), [{ name: 'Rae', role: 'owner' }]);
    const second = await buildFirm(em(), [{ name: 'Sol', role: 'owner' }]);
    const rae = first.members[0];
    await inviteToTeam(em(), { companyId: second.company.id, invitedById: second.members[0].user.id, email: rae.email, role: 'sales' });
    await deliverMailTo(em(), rae.email);
    const token = linkToken((await waitForMail({ to: rae.email, subject: second.company.name })).text, 'invite');
    expect(await readInvite(em(), token)).toMatchObject({ state: 'open', hasAccount: true });
    await expect(acceptInvite(em(), token, { password: 'not her password' })).rejects.toMatchObject({
      fields: { password: 'That is not your Lapwing password.' },
    });
    // The failed attempt did not spend the link.
    expect(await acceptInvite(em(), token, { password: rae.password })).toEqual({ userId: rae.user.id, companyId: second.company.id });
    expect(await em().count(Membership, { user: rae.user.id })).toBe(2);
  });

  test('inviting someone already on the team is refused next to the e-mail field', async () => {
    const { members, company } = await buildFirm(em(), [
      { name: 'Tam', role: 'owner' },
      { name: 'Uma', role: 'sales' },
    ]);
    await expect(inviteToTeam(em(), { companyId: company.id, invitedById: members[0].user.id, email: members[1].email, role: 'sales' })).rejects.toMatchObject({
      fields: { email: 'Already on the team.' },
    });
  });

  test('the last owner can be neither removed nor demoted; a changed role ends that person’s sessions', async () => {
    const { members, company } = await buildFirm(em(), [
      { name: 'Vic', role: 'owner' },
      { name: 'Wes', role: 'sales' },
    ]);
    const [vic, wes] = members;
    await expect(removeMember(em(), { companyId: company.id, membershipId: vic.membership.id })).rejects.toBeInstanceOf(Conflict);
    await expect(changeRole(em(), { companyId: company.id, membershipId: vic.membership.id, role: 'sales', actingSessionToken: null })).rejects.toBeInstanceOf(
      Conflict,
    );

    const wesSession = await startSession(wes.user.id, company.id);
    await changeRole(em(), { companyId: company.id, membershipId: wes.membership.id, role: 'owner', actingSessionToken: null });
    expect((await getLucia().validateSession(wesSession.token)).session).toBeNull();
    // Now there are two owners, so one may step down, and then be removed.
    await changeRole(em(), { companyId: company.id, membershipId: vic.membership.id, role: 'sales', actingSessionToken: null });
    await removeMember(em(), { companyId: company.id, membershipId: vic.membership.id });
    const team = await listTeam(em(), company.id);
    expect(team.members.map((m) => `${m.name}:${m.role}`)).toEqual(['Wes:owner']);
  });

  test('another firm’s members and invitations are not found, and nothing changes', async () => {
    const mine = await buildFirm(em(), [{ name: 'Xan', role: 'owner' }]);
    const theirs = await buildFirm(em(), [
      { name: 'Yul', role: 'owner' },
      { name: 'Zed', role: 'sales' },
    ]);
    const before = await listTeam(em(), theirs.company.id);
    const target = theirs.members[1].membership.id;
    await expect(changeRole(em(), { companyId: mine.company.id, membershipId: target, role: 'owner', actingSessionToken: null })).rejects.toBeInstanceOf(
      NotFound,
    );
    await expect(removeMember(em(), { companyId: mine.company.id, membershipId: target })).rejects.toBeInstanceOf(NotFound);
    expect(await listTeam(em(), theirs.company.id)).toEqual(before);
    expect((await listTeam(em(), mine.company.id)).members.map((m) => m.name)).toEqual(['Xan']);
  });
});

describe('password reset', () => {
  test('a reset link arrives by e-mail, works once, ends every session and clears the sign-in throttle', async () => {
    const { members, company } = await buildFirm(em(), [{ name: 'Abe', role: 'sales' }]);
    const [abe] = members;
    const session = await startSession(abe.user.id, company.id);
    await requestPasswordReset(em(), { email: abe.email, address: anAddress() });
    await afterResponseSettled();
    await deliverMailTo(em(), abe.email);
    const mail = await waitForMail({ to: abe.email, subject: 'Choose a new Lapwing password' });
    const token = linkToken(mail.text, 'reset');
    expect(await em().count(PasswordReset, { tokenDigest: token })).toBe(0);
    expect(await readPasswordReset(em(), token)).toBe('open');

    await completePasswordReset(em(), token, 'my new reset password');
    expect((await getLucia().validateSession(session.token)).session).toBeNull();
    expect(await checkSignIn(em(), { email: abe.email, password: 'my new reset password', address: anAddress() })).toMatchObject({ userId: abe.user.id });
    expect(await readPasswordReset(em(), token)).toBe('used');
    await expect(completePasswordReset(em(), token, 'yet another password')).rejects.toThrow(RESET_PROBLEMS.used);
  });

  test('an unknown address gets the same quiet answer and no e-mail; an expired link is refused', async () => {
    const nobody = `nobody-${Date.now()}@firm.test`;
    await expect(requestPasswordReset(em(), { email: nobody, address: anAddress() })).resolves.toBeUndefined();
    await afterResponseSettled();
    await deliverMailTo(em(), nobody);
    expect(await mailTo(nobody)).toEqual([]);

    const { members } = await buildFirm(em(), [{ name: 'Bea', role: 'owner' }]);
    await requestPasswordReset(em(), { email: members[0].email, address: anAddress() });
    await afterResponseSettled();
    await deliverMailTo(em(), members[0].email);
    const token = linkToken((await waitForMail({ to: members[0].email })).text, 'reset');
    await em().nativeUpdate(PasswordReset, { user: members[0].user.id }, { expiresAt: new Date(Date.now() - 1000) });
    expect(await readPasswordReset(em(), token)).toBe('expired');
    await expect(completePasswordReset(em(), token, 'a long new password')).rejects.toThrow(RESET_PROBLEMS.expired);
  });

  test('the answer does the same database work for an address with an account as for one without', async () => {
    const { members } = await buildFirm(em(), [{ name: 'Cal', role: 'owner' }]);
    const address = anAddress();
    // Every statement any pool of this process sends, as text (the values differ, the statements must not).
    const statementsDuring = async (work: () => Promise<unknown>): Promise<string[]> => {
      const spy = vi.spyOn(pg.Client.prototype, 'query');
      try {
        await work();
        return spy.mock.calls.map(([statement]) => (typeof statement === 'string' ? statement : (statement as { text: string }).text));
      } finally {
        spy.mockRestore();
      }
    };
    // Warm the pools and limiters first, so neither measured request pays for opening them.
    // Each request's later work is let finish before the next is recorded, so it cannot blur them.
    await requestPasswordReset(em(), { email: `warm-up-${Date.now()}@firm.test`, address });
    await afterResponseSettled();
    const known = await statementsDuring(() => requestPasswordReset(em(), { email: members[0].email, address }));
    await afterResponseSettled();
    const unknown = await statementsDuring(() => requestPasswordReset(em(), { email: `nobody-${Date.now()}@firm.test`, address }));
    // Timing cannot tell the two apart when the work done before answering is the same statement for
    // statement. Source: OWASP Forgot Password Cheat Sheet ("consistent response time" for existing
    // and non-existing accounts).
    expect(known).toEqual(unknown);
    expect(known.join('\n')).not.toMatch(/app_user|password_reset|mail_outbox/);

    // The work itself still happens, after the answer: a link for the account, nothing for the other.
    await afterResponseSettled();
    expect(await em().count(PasswordReset, { user: members[0].user.id })).toBe(1);
    await deliverMailTo(em(), members[0].email);
    expect((await waitForMail({ to: members[0].email, subject: 'Choose a new Lapwing password' })).text).toContain('/reset/');
  });
});
