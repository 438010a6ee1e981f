/**
 * "Estimate a project with a firm's published rates and present it": the one place the widget's
 * live range, a new lead and (later) staff-entered inquiries get their numbers from.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { EstimateInputError, type Estimate, type Project } from '~/lib/estimate';
import type { Company } from '../companies/company.entity';
import { InvalidInput } from '../errors';
import type { RateBookVersion } from '../rates/rate-book-version.entity';
import { publishedRates } from '../rates/rate-book.service';
import { computeEstimate } from './estimate-pool';
import { presentForHomeowner, type HomeownerEstimate } from './present-estimate';

export type FirmEstimate = {
  /** The core's whole answer (takeoff and price), stored as the lead's snapshot. */
  result: Estimate;
  /** The Rate book version it was priced with. */
  version: RateBookVersion;
  /** What the homeowner is shown of it (no unit rates). */
  view: HomeownerEstimate;
};

/**
 * Prices a project that has already passed the core's project schema (as part of the request's own
 * schema) with the firm's published rates, on the estimate pool (off the event loop). Problems only the rate book can tell (an unknown
 * treatment, openings that do not fit) become InvalidInput with paths under `fieldPrefix`.
 */
export async function estimateForFirm(em: EntityManager, company: Company, project: Project, fieldPrefix = 'project'): Promise<FirmEstimate> {
  const { version, rateBook } = await publishedRates(em, company.id);
  let result: Estimate;
  try {
    result = await computeEstimate(project, rateBook);
  } catch (error) {
    if (error instanceof EstimateInputError) throw new InvalidInput(error.message, prefixed(error.fields, fieldPrefix));
    throw error;
  }
  return { result, version, view: presentForHomeowner(result) };
}

function prefixed(fields: Record<string, string>, prefix: string): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [path, message] of Object.entries(fields)) out[`${prefix}.${path}`] = message;
  return out;
}
