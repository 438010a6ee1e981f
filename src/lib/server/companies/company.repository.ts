import type { EntityManager } from '@mikro-orm/postgresql';
import { NotFound } from '../errors';
import { Company } from './company.entity';

/**
 * How long a process may answer public widget requests from its cached copy of a firm's settings.
 * A change in Setup (allowed sites, brand colour) reaches every process within this time.
 */
export const COMPANY_CACHE_MS = 10_000;

/** The firm behind a public URL; unknown slugs are NotFound. */
export async function companyBySlug(em: EntityManager, slug: string): Promise<Company> {
  if (!/^[a-z0-9][a-z0-9-]{0,59}$/.test(slug)) throw new NotFound('No firm at this address.');
  const company = await em.findOne(Company, { slug }, { cache: [`company-by-slug:${slug}`, COMPANY_CACHE_MS] });
  if (!company) throw new NotFound('No firm at this address.');
  return company;
}
