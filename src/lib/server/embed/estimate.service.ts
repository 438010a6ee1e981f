import type { EntityManager } from '@mikro-orm/postgresql';
import { EstimateInputError, estimate, type Estimate } from '../../estimate';
import type { Company } from '../companies/company.entity';
import { InvalidInput } from '../errors';
import { publishedRates, type PublishedRates } from '../rates/rate-book.service';

/** Runs the estimating core with the firm's published rates; bad project input names its fields. */
export async function estimateWithPublishedRates(
  em: EntityManager,
  company: Company,
  project: unknown,
  fieldPrefix = 'project',
): Promise<{ result: Estimate; rates: PublishedRates }> {
  const rates = await publishedRates(em, company.id);
  try {
    return { result: estimate(project, rates.rateBook, { rateBookParsed: true }), rates };
  } catch (error) {
    if (error instanceof EstimateInputError) {
      const fields: Record<string, string> = {};
      for (const [path, message] of Object.entries(error.fields)) fields[`${fieldPrefix}.${path}`] = message;
      throw new InvalidInput(error.message, fields);
    }
    throw error;
  }
}
