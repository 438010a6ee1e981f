import { TooManyRequests } from '../errors';
import { limiter } from '../rate-limit';

/**
 * Failed sign-ins are counted per account and per network address (two counters, as the
 * rate-limiter-flexible "login endpoint protection" example does; OWASP ASVS 4.0.3 2.2.1 asks for
 * at most 100 failures an hour on one account, from memory). Past a few failures each attempt is
 * slowed; past the limit the key is refused for a while. A correct password resets the account count.
 */
// common practice, no source: 10 failures in 15 minutes, then 15 minutes refused.
export const ACCOUNT_LIMIT = { points: 10, duration: 15 * 60, blockDuration: 15 * 60 };
// common practice, no source: one office's network may hold many staff, so the address limit is wider.
export const ADDRESS_LIMIT = { points: 50, duration: 60 * 60, blockDuration: 60 * 60 };
/** Failures before each further attempt is slowed down. common practice, no source. */
export const SLOW_AFTER = 3;

const perAccount = limiter('sign-in:account', ACCOUNT_LIMIT);
const perAddress = limiter('sign-in:address', ADDRESS_LIMIT);

function minutes(seconds: number): string {
  const m = Math.ceil(seconds / 60);
  return m <= 1 ? 'a minute' : `${m} minutes`;
}

/** Throws TooManyRequests when this account or address is refused right now; otherwise waits as long as earlier failures ask. */
export async function beforeSignInAttempt(email: string, address: string): Promise<void> {
  const [accountWait, addressWait] = await Promise.all([perAccount.refusedFor(email), perAddress.refusedFor(address)]);
  if (accountWait)
    throw new TooManyRequests(`Too many failed sign-ins for this account. Try again in ${minutes(accountWait)}, or reset your password.`, accountWait);
  if (addressWait) throw new TooManyRequests(`Too many failed sign-ins from your network. Try again in ${minutes(addressWait)}.`, addressWait);
  const wait = slowDownMs(await perAccount.used(email));
  if (wait > 0) await slowDown.wait(wait);
}

/** How long an attempt waits after `failures` failed ones: 250 ms more per failure past SLOW_AFTER, at most 2 s. */
export function slowDownMs(failures: number): number {
  return failures >= SLOW_AFTER ? Math.min((failures - SLOW_AFTER + 1) * 250, 2000) : 0;
}

/** The wait itself, in an object so that a test can see the waits asked for without spending them. */
export const slowDown = {
  wait: (ms: number): Promise<void> => new Promise((resolve) => setTimeout(resolve, ms)),
};

/** Counts a failure; the failure that uses up the last point is answered with the refusal itself. */
export async function afterFailedSignIn(email: string, address: string): Promise<void> {
  await perAccount.consume(email, `Too many failed sign-ins for this account. Try again in ${minutes(ACCOUNT_LIMIT.blockDuration)}, or reset your password.`);
  await perAddress.consume(address, `Too many failed sign-ins from your network. Try again in ${minutes(ADDRESS_LIMIT.blockDuration)}.`);
}

export async function afterSuccessfulSignIn(email: string): Promise<void> {
  await perAccount.reset(email);
}
