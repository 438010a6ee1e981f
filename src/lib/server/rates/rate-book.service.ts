import type { EntityManager } from '@mikro-orm/postgresql';
import type { RateBook } from '~/lib/estimate';
import { RateBookVersion } from './rate-book-version.entity';
import { storedRateBook } from './stored-rate-book';
import { AppError } from '../errors';

export type PublishedRates = { version: RateBookVersion; rateBook: RateBook };

/** The firm has published no Rate book yet, so it cannot give estimates (503: try them directly). */
export class RatesNotPublished extends AppError {
  constructor() {
    super('This firm has not published its rates yet. Please contact them directly.', 503);
  }
}

// A version's numbers never change once published, so its parsed form can be kept per process.
const parsedByVersion = new Map<string, RateBook>();

/**
 * How long a process may keep answering with the version it last saw as published. Publishing a new
 * version reaches every process within this time (publishing code may also clear the cache key).
 */
export const PUBLISHED_RATES_CACHE_MS = 10_000;
export const publishedRatesCacheKey = (companyId: string) => `published-rates:${companyId}`;

/** The firm's published Rate book, parsed. A firm without one cannot give estimates yet (503). */
export async function publishedRates(em: EntityManager, companyId: string): Promise<PublishedRates> {
  const published = await publishedRatesIfAny(em, companyId);
  if (!published) throw new RatesNotPublished();
  return published;
}

/** The firm's published Rate book, parsed, or null while it has none (for pages that work without one). */
export async function publishedRatesIfAny(em: EntityManager, companyId: string): Promise<PublishedRates | null> {
  const version = await em.findOne(
    RateBookVersion,
    { company: companyId, status: 'published' },
    { orderBy: { number: 'desc' }, cache: [publishedRatesCacheKey(companyId), PUBLISHED_RATES_CACHE_MS] },
  );
  if (!version) return null;
  let rateBook = parsedByVersion.get(version.id);
  if (!rateBook) {
    rateBook = storedRateBook.read(version.data);
    if (parsedByVersion.size > 500) parsedByVersion.clear();
    parsedByVersion.set(version.id, rateBook);
  }
  return { version, rateBook };
}
