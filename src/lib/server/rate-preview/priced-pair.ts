import { EstimateInputError, checkProject, validateProject, type Project, type RateBook } from '~/lib/estimate';
import { computeEstimate } from '../estimates/estimate-pool';

/** One project's price under one version: its range, or why that version cannot price it. */
export type PricedSide = { ok: true; lowCents: number; highCents: number; middleCents: number; minimumApplied: boolean } | { ok: false; reason: string };

/**
 * The project priced by a rate book, on the estimate pool. A project the version cannot price (a
 * finish it no longer offers, a trip zone it dropped) is an answer, not an error: the owner needs
 * to see that the change would refuse it.
 */
export async function priceWith(input: { project: Project } | { projectInput: unknown }, rates: RateBook): Promise<PricedSide> {
  try {
    // A stored inquiry's project passed the project schema once; only the catalogue checks remain.
    const project =
      'project' in input
        ? checkProject(input.project, rates.catalogue, rates.extras.tripZones, rates.units)
        : validateProject(input.projectInput, rates.catalogue, rates.extras.tripZones, rates.units);
    const { price } = await computeEstimate(project, rates);
    return {
      ok: true,
      lowCents: price.lowCents,
      highCents: price.highCents,
      middleCents: Math.round((price.lowCents + price.highCents) / 2),
      minimumApplied: price.minimumApplied,
    };
  } catch (error) {
    if (error instanceof EstimateInputError) return { ok: false, reason: error.message };
    throw error;
  }
}
