/**
 * Rows for tests, built with real data (the core's sample rate book and a real estimate), so a test
 * that needs "a lead" or "a rate book version" gets one that every reader of those rows accepts.
 */
import { randomBytes } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import { estimate, sampleProject, sampleRateBook, type RateBookInput } from '../../src/lib/estimate';
import { estimateSnapshot } from '../../src/lib/server/estimates/estimate-snapshot';
import { Lead } from '../../src/lib/server/leads/lead.entity';
import { leadInputs } from '../../src/lib/server/leads/lead-inputs';
import { RateBookVersion } from '../../src/lib/server/rates/rate-book-version.entity';
import { storedRateBook } from '../../src/lib/server/rates/stored-rate-book';

/**
 * A rate book version of a firm, numbered so it never collides: retired unless said otherwise (a firm
 * has at most one draft and one published version, and a lead's version is one of its old ones).
 */
export function buildRateBookVersion(
  em: EntityManager,
  companyId: string,
  overrides: { status?: 'draft' | 'published' | 'retired'; rates?: RateBookInput; number?: number } = {},
): RateBookVersion {
  return em.create(RateBookVersion, {
    company: companyId,
    number: overrides.number ?? Math.floor(Math.random() * 1e9),
    status: overrides.status ?? 'retired',
    data: storedRateBook.wrap(overrides.rates ?? sampleRateBook()),
    publishedAt: overrides.status === 'published' ? new Date() : null,
  });
}

/**
 * A lead of a firm with the sample project priced by the sample rate book (or `rates`, e.g. a
 * metric one). Flush to store it.
 */
export function buildLead(
  em: EntityManager,
  companyId: string,
  overrides: Partial<Pick<Lead, 'name' | 'email' | 'draftId' | 'createdAt'>> & { rateBookVersion?: RateBookVersion; rates?: RateBookInput } = {},
): Lead {
  const rates = overrides.rates ?? sampleRateBook();
  const project = sampleProject();
  const result = estimate(project, rates);
  const version = overrides.rateBookVersion ?? buildRateBookVersion(em, companyId, { rates });
  return em.create(Lead, {
    company: companyId,
    reference: randomBytes(4).toString('hex').toUpperCase(),
    name: overrides.name ?? 'Test Homeowner',
    email: overrides.email ?? `home-${randomBytes(3).toString('hex')}@example.test`,
    phone: '+15125550147',
    address: '1 Test Lane',
    postcode: '78704',
    preferredContact: 'email',
    consentAt: new Date(),
    inputs: leadInputs.wrap(project),
    estimate: estimateSnapshot.wrap(result),
    rateBookVersion: version,
    rangeLowCents: result.price.lowCents,
    rangeHighCents: result.price.highCents,
    idempotencyKey: randomBytes(12).toString('hex'),
    draftId: overrides.draftId ?? null,
    viewTokenHash: randomBytes(32).toString('hex'),
    ...(overrides.createdAt ? { createdAt: overrides.createdAt } : {}),
  });
}
