/**
 * The p-th percentile of some numbers by linear interpolation between the two nearest ranks: the
 * definition PostgreSQL's `percentile_cont` uses (and spreadsheets' PERCENTILE.INC), definition 7
 * of Hyndman and Fan (1996). Null for no numbers. The median is `percentile(values, 0.5)`.
 */
export function percentile(values: readonly number[], p: number): number | null {
  if (!(p >= 0 && p <= 1)) throw new RangeError(`A percentile is between 0 and 1, not ${p}.`);
  if (values.length === 0) return null;
  const sorted = [...values].sort((a, b) => a - b);
  const position = (sorted.length - 1) * p;
  const below = Math.floor(position);
  const above = Math.ceil(position);
  return sorted[below]! + (sorted[above]! - sorted[below]!) * (position - below);
}
