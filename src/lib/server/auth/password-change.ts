import type { EntityManager } from '@mikro-orm/postgresql';
import { InvalidInput } from '../errors';
import { hashPassword, verifyPassword } from '../users/password';
import { User } from '../users/user.entity';
import { endOtherSessions } from './sessions';
import { afterFailedSignIn, beforeSignInAttempt } from './sign-in-throttle';

/**
 * Changes a signed-in person's password after checking the current one (wrong guesses count toward
 * the sign-in throttle). Every other session of theirs ends; the one making the change stays.
 * Source: OWASP ASVS 4.0.3 3.3.3 (from memory).
 */
export async function changePassword(
  em: EntityManager,
  input: { userId: string; currentPassword: string; newPassword: string; keepSessionToken: string; address: string },
): Promise<{ endedSessions: number }> {
  const user = await em.findOneOrFail(User, { id: input.userId }, { populate: ['passwordHash'] });
  await beforeSignInAttempt(user.email, input.address);
  if (!user.passwordHash || !(await verifyPassword(user.passwordHash, input.currentPassword))) {
    await afterFailedSignIn(user.email, input.address);
    throw new InvalidInput('Some fields need attention.', { currentPassword: 'That is not your current password.' });
  }
  user.passwordHash = await hashPassword(input.newPassword);
  await em.flush();
  return { endedSessions: await endOtherSessions(em, user.id, input.keepSessionToken) };
}
