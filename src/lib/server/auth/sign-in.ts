import type { EntityManager } from '@mikro-orm/postgresql';
import { InvalidInput } from '../errors';
import { Membership } from '../users/membership.entity';
import { hashPassword, verifyPassword } from '../users/password';
import { User } from '../users/user.entity';
import { afterFailedSignIn, afterSuccessfulSignIn, beforeSignInAttempt } from './sign-in-throttle';

const WRONG = 'That e-mail address and password do not match. Check both, or reset your password.';

let dummyHash: Promise<string> | undefined;

/**
 * Checks an e-mail and password. Returns the person and the firm to start in (the first by name;
 * they can switch in the staff area). An unknown address costs the same hash work as a known one,
 * so the answer time does not reveal which addresses have accounts.
 */
export async function checkSignIn(
  em: EntityManager,
  { email, password, address }: { email: string; password: string; address: string },
): Promise<{ userId: string; companyId: string }> {
  await beforeSignInAttempt(email, address);
  const user = await em.findOne(User, { email }, { populate: ['passwordHash'] });
  let matches: boolean;
  if (user?.passwordHash) {
    matches = await verifyPassword(user.passwordHash, password);
  } else {
    dummyHash ??= hashPassword('an unused password that only costs time');
    await verifyPassword(await dummyHash, password);
    matches = false;
  }
  if (!user || !matches) {
    await afterFailedSignIn(email, address);
    throw new InvalidInput(WRONG, { password: WRONG });
  }
  await afterSuccessfulSignIn(email);
  const first = await em.findOne(Membership, { user }, { populate: ['company'], orderBy: { company: { name: 'asc' } } });
  if (!first)
    throw new InvalidInput('This sign-in is not on any firm’s team any more. Ask the firm’s owner to invite you again.', { email: 'Not on any team.' });
  return { userId: user.id, companyId: first.company.id };
}
