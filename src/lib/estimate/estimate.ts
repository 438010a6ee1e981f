import { priceRange } from './pricing.ts';
import { checkProjectSize } from './project-size.ts';
import type { Project, RateBook } from './schemas.ts';
import { takeoffOf } from './takeoff.ts';
import type { Estimate } from './types.ts';
import { checkProject, parseRateBook, validateProject } from './validate.ts';

/**
 * The whole estimate from raw input: parses the rate book (errors under `rateBook.`), validates the
 * project against it (throws EstimateInputError with field paths), checks its size (a project too
 * big to price online is refused before any work), takes off every wall and room, prices it and
 * gives the range. Returns plain JSON-serialisable data.
 */
export function estimate(project: unknown, rateBook: unknown): Estimate {
  const rates = parseRateBook(rateBook);
  return estimateParsed(validateProject(project, rates.catalogue, rates.extras.tripZones, rates.units), rates);
}

/**
 * The same for input that is already parsed: a project that passed `projectSchema` and a rate book
 * that passed `parseRateBook`. Only the checks that need the rate book run again.
 */
export function estimateParsed(project: Project, rates: RateBook): Estimate {
  const checked = checkProject(project, rates.catalogue, rates.extras.tripZones, rates.units);
  checkProjectSize(checked, rates.catalogue);
  const takeoff = takeoffOf(checked, rates.catalogue, rates.units);
  return { takeoff, price: priceRange(takeoff, rates) };
}
