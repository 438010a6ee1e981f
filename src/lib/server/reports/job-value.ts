import type { Lead } from '../leads/lead.entity';

/**
 * What a job going ahead is worth to the report, in cents: for now the middle of the range the
 * homeowner was shown (the estimate as stored on the inquiry, re-priced after a site measurement).
 * The seam for accepted quotes: once an inquiry has one, its total replaces this, here and only here.
 */
export function jobValueCents(lead: Pick<Lead, 'rangeLowCents' | 'rangeHighCents'>): number {
  return (lead.rangeLowCents + lead.rangeHighCents) / 2;
}
