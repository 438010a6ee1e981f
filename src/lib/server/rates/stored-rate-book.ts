import { rateBookSchema, type RateBook, type RateBookInput } from '~/lib/estimate';
import { versionedJson } from '../db/versioned-json';

/**
 * A Rate book version's numbers as stored: the owner's input in a versioned envelope, read back
 * as the parsed RateBook. A new rate-book field either has a default in the core's schema or gets
 * an upgrade step here, so published versions from before it keep pricing.
 */
export const storedRateBook = versionedJson<RateBook, RateBookInput>({
  name: 'rate book',
  version: 1,
  schema: rateBookSchema,
  // Version 0: rate books stored before envelopes, already in the version-1 shape.
  upgrades: { 0: (data) => data },
});
