import { createHash } from 'node:crypto';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { currentOrm } from './db/orm-provider';
import { TooManyRequests } from './errors';

/**
 * Counters that hold across every app process: they live in PostgreSQL (table `rate_limit`, created
 * by the migrations), through `rate-limiter-flexible`'s PostgreSQL store.
 *
 *   const perAddress = limiter('lead-form:address', { points: 5, duration: 600 });
 *   await perAddress.consume(clientAddress, 'Too many requests from your network.');
 */
export type LimiterOptions = {
  /** How many points a key may use per window. */
  points: number;
  /** The window, in seconds. */
  duration: number;
  /** Once the points are used up, refuse the key for this many seconds (default: until the window ends). */
  blockDuration?: number;
};

export type Limiter = {
  /** Uses points for a key; throws TooManyRequests (with Retry-After) when none are left. */
  consume(key: string, message: string, points?: number): Promise<void>;
  /** Points used so far in the current window (0 for an unknown key). */
  used(key: string): Promise<number>;
  /** Seconds until the key may use a point again (0 when it has points left). */
  refusedFor(key: string): Promise<number>;
  /** Forgets a key, e.g. after a successful sign-in. */
  reset(key: string): Promise<void>;
};

/**
 * Keys are hashed before they are stored, so the table holds no e-mail or IP addresses.
 * The name keeps one limiter's keys apart from another's.
 */
function storedKey(key: string): string {
  return createHash('sha256').update(key).digest('base64url');
}

const limiters = new Map<string, RateLimiterPostgres>();

/**
 * The counters use the ORM's own connection pool (knex's), so a process has one pool: it drops a
 * connection the server ended (a restart, 57P01) and opens a fresh one, where a pool of our own
 * would need the same care.
 */
async function store(name: string, options: LimiterOptions): Promise<RateLimiterPostgres> {
  let found = limiters.get(name);
  if (!found) {
    const knex = (await currentOrm()).em.getConnection().getKnex();
    found = new RateLimiterPostgres({
      storeClient: knex,
      storeType: 'knex',
      tableName: 'rate_limit',
      tableCreated: true,
      keyPrefix: name,
      points: options.points,
      duration: options.duration,
      blockDuration: options.blockDuration ?? 0,
    });
    limiters.set(name, found);
  }
  return found;
}

export function limiter(name: string, options: LimiterOptions): Limiter {
  const counters = () => store(name, options);
  return {
    async consume(key, message, points = 1) {
      try {
        await (await counters()).consume(storedKey(key), points);
      } catch (refusal) {
        if (refusal instanceof RateLimiterRes) throw new TooManyRequests(message, refusal.msBeforeNext / 1000);
        throw refusal;
      }
    },
    async used(key) {
      const state = await (await counters()).get(storedKey(key));
      return state?.consumedPoints ?? 0;
    },
    async refusedFor(key) {
      const state = await (await counters()).get(storedKey(key));
      if (!state || state.consumedPoints < options.points) return 0;
      return Math.max(1, Math.ceil(state.msBeforeNext / 1000));
    },
    async reset(key) {
      await (await counters()).delete(storedKey(key));
    },
  };
}
