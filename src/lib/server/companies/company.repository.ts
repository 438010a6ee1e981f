import type { EntityManager } from '@mikro-orm/postgresql';
import { NotFound } from '../errors';
import { Company } from './company.entity';

/**
 * The firm behind a public URL; unknown slugs are NotFound. Read from the database on every request
 * (one lookup by a unique index): the allowed sites decide framing and CORS, and a per-process copy
 * would let another process go on answering by the old list after the owner changed it.
 */
export async function companyBySlug(em: EntityManager, slug: string): Promise<Company> {
  if (!/^[a-z0-9][a-z0-9-]{0,59}$/.test(slug)) throw new NotFound('No firm at this address.');
  const company = await em.findOne(Company, { slug });
  if (!company) throw new NotFound('No firm at this address.');
  return company;
}
