import type { EntityManager } from '@mikro-orm/postgresql';
import { EstimateInputError, type Estimate } from '../../estimate';
import type { Company } from '../companies/company.entity';
import { InvalidInput } from '../errors';
import { publishedRates, type PublishedRates } from '../rates/rate-book.service';
import { computeEstimate } from '../estimates/estimate-pool';

/** Runs the estimating core (on the estimate pool) with the firm's published rates; bad project input names its fields. */
export async function estimateWithPublishedRates(
  em: EntityManager,
  company: Company,
  project: unknown,
  fieldPrefix = 'project',
): Promise<{ result: Estimate; rates: PublishedRates }> {
  const rates = await publishedRates(em, company.id);
  try {
    return { result: await computeEstimate(project, rates.rateBook), rates };
  } catch (error) {
    if (error instanceof EstimateInputError) {
      const fields: Record<string, string> = {};
      for (const [path, message] of Object.entries(error.fields)) fields[`${fieldPrefix}.${path}`] = message;
      throw new InvalidInput(error.message, fields);
    }
    throw error;
  }
}
