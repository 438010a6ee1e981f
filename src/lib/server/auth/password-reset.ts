import type { EntityManager } from '@mikro-orm/postgresql';
import { afterResponse } from '../after-response';
import { now } from '../clock';
import { InvalidInput } from '../errors';
import { enqueueMail } from '../mail/outbox';
import { kickMailDelivery } from '../mail/delivery-job';
import { limiter } from '../rate-limit';
import { hashPassword } from '../users/password';
import { User } from '../users/user.entity';
import { timeZoneOfUser } from '../users/memberships';
import { passwordResetMail } from './mails';
import { PasswordReset } from './password-reset.entity';
import { Session } from './session.entity';
import { afterSuccessfulSignIn } from './sign-in-throttle';
import { linkTokenDigest, looksLikeLinkToken, newLinkToken } from './tokens';

/** A reset link works for an hour. Source: OWASP Forgot Password Cheat Sheet, short-lived tokens (from memory). */
export const RESET_LIFETIME_MS = 60 * 60 * 1000;

// common practice, no source: a handful of reset e-mails an hour per address is plenty for a person
// and keeps the form from being used to flood someone's inbox.
const perEmail = limiter('reset:email', { points: 3, duration: 60 * 60 });
const perAddress = limiter('reset:address', { points: 20, duration: 60 * 60, blockDuration: 60 * 60 });

export const RESET_PROBLEMS = {
  unknown: 'This reset link is not valid. Check that the whole link was copied, or ask for a new one.',
  expired: 'This reset link has expired. Ask for a new one below.',
  used: 'This reset link has already been used. Ask for a new one if you still need it.',
} as const;

/**
 * Sends a reset link if the address belongs to someone who signs in. The caller answers the same
 * way whether or not it does, so the form does not reveal who has an account; and since looking the
 * address up and writing the link take time only when there is an account, that work happens after
 * the answer: before it, every address costs the same one rate-limit statement.
 * Source: OWASP Forgot Password Cheat Sheet, "return a consistent message for both existent and
 * non-existent accounts" and "ensure that responses return in a consistent amount of time".
 */
export async function requestPasswordReset(em: EntityManager, input: { email: string; address: string }): Promise<void> {
  await perAddress.consume(input.address, 'Too many reset requests from your network. Try again in an hour.');
  const work = em.fork();
  afterResponse('password reset e-mail', () => sendResetLinkIfAccount(work, input.email));
}

async function sendResetLinkIfAccount(em: EntityManager, email: string): Promise<void> {
  const user = await em.findOne(User, { email }, { populate: ['passwordHash'] });
  if (!user?.passwordHash) return;
  if ((await perEmail.used(email)) >= 3) return;
  await perEmail.consume(email, 'unused: checked above');
  const token = newLinkToken();
  const reset = em.create(PasswordReset, {
    user,
    tokenDigest: linkTokenDigest('password-reset', token),
    expiresAt: new Date(now().getTime() + RESET_LIFETIME_MS),
  });
  const mail = passwordResetMail({ name: user.name, token, expiresAt: reset.expiresAt, timeZone: await timeZoneOfUser(em, user.id) });
  enqueueMail(em, { to: user.email, subject: mail.subject, text: mail.text });
  await em.flush();
  kickMailDelivery();
}

async function findByToken(em: EntityManager, token: string): Promise<PasswordReset | null> {
  if (!looksLikeLinkToken(token)) return null;
  return em.findOne(PasswordReset, { tokenDigest: linkTokenDigest('password-reset', token) });
}

/** Whether a reset link can be used, for the page that shows the form. */
export async function readPasswordReset(em: EntityManager, token: string): Promise<'open' | keyof typeof RESET_PROBLEMS> {
  const reset = await findByToken(em, token);
  if (!reset) return 'unknown';
  if (reset.usedAt) return 'used';
  if (reset.expiresAt <= now()) return 'expired';
  return 'open';
}

/**
 * Sets a new password from a reset link. The link is spent atomically; every session of the person
 * ends (whoever else was signed in is out) and the sign-in throttle for the account is cleared.
 */
export async function completePasswordReset(em: EntityManager, token: string, password: string): Promise<{ email: string }> {
  const email = await em.transactional(async (tx) => {
    const reset = await findByToken(tx, token);
    if (!reset) throw new InvalidInput(RESET_PROBLEMS.unknown);
    const at = now();
    const spent = await tx.nativeUpdate(PasswordReset, { id: reset.id, usedAt: null, expiresAt: { $gt: at } }, { usedAt: at });
    if (spent !== 1) throw new InvalidInput(reset.usedAt ? RESET_PROBLEMS.used : reset.expiresAt <= at ? RESET_PROBLEMS.expired : RESET_PROBLEMS.used);
    const user = await tx.findOneOrFail(User, { id: reset.user.id });
    user.passwordHash = await hashPassword(password);
    await tx.flush();
    // Other open links of this person are spent too: the password they were for is gone.
    await tx.nativeUpdate(PasswordReset, { user, usedAt: null }, { usedAt: at });
    await tx.nativeDelete(Session, { user });
    return user.email;
  });
  await afterSuccessfulSignIn(email);
  return { email };
}
