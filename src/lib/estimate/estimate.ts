import { priceRange } from './pricing.ts';
import { checkProjectSize } from './project-size.ts';
import type { RateBook } from './schemas.ts';
import { takeoffOf } from './takeoff.ts';
import type { Estimate } from './types.ts';
import { parseRateBook, validateProject } from './validate.ts';

/**
 * The whole estimate: validates the project against the rate book (throws EstimateInputError with
 * field paths) and checks its size (a project too big to price online is refused before any work),
 * takes off every wall and room, prices it and gives the range. `rateBook` may be raw input (it is
 * then parsed; errors are under `rateBook.`) or an already parsed RateBook.
 * Returns plain JSON-serialisable data.
 */
export function estimate(project: unknown, rateBook: unknown, opts: { rateBookParsed?: boolean } = {}): Estimate {
  const rb = opts.rateBookParsed ? (rateBook as RateBook) : parseRateBook(rateBook);
  const p = validateProject(project, rb.catalogue, rb.extras.tripZones);
  checkProjectSize(p, rb.catalogue);
  const takeoff = takeoffOf(p, rb.catalogue, rb.units);
  return { takeoff, price: priceRange(takeoff, rb) };
}
