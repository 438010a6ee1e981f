/** Money is integer cents (hundredths of the currency unit) everywhere; only formatting divides. */

/** Formats cents with Intl in the firm's currency and locale, e.g. 435000 → "$4,350.00". */
export function formatMoney(cents: number, currency: string, locale = 'en-US', opts: { wholeUnits?: boolean } = {}): string {
  if (!Number.isInteger(cents)) throw new RangeError('formatMoney: cents must be an integer');
  const whole = opts.wholeUnits ?? false;
  // Building an Intl.NumberFormat costs far more than using one, so each is kept (a handful per process).
  const key = `${locale}|${currency}|${whole ? 1 : 0}`;
  let f = formatters.get(key);
  if (!f) {
    f = new Intl.NumberFormat(locale, {
      style: 'currency',
      currency,
      ...(whole ? { minimumFractionDigits: 0, maximumFractionDigits: 0 } : {}),
    });
    if (formatters.size > 100) formatters.clear();
    formatters.set(key, f);
  }
  return f.format(cents / 100);
}

const formatters = new Map<string, Intl.NumberFormat>();

/** Rounds down to a multiple of `step` cents. */
export const roundDownTo = (cents: number, step: number): number => Math.floor(cents / step) * step;
/** Rounds up to a multiple of `step` cents. */
export const roundUpTo = (cents: number, step: number): number => Math.ceil(cents / step) * step;

/**
 * Rounds parts to multiples of `step` so that they add up exactly to their sum rounded to the nearest
 * step (half up): each part is rounded down, and the steps left over go one each to the parts with the
 * largest remainders, the earlier part first on a tie (the largest-remainder method, docs/sources.md §53).
 * Rounding each part on its own would let "about" figures disagree with the total they explain.
 */
export function apportionToStep(partsCents: readonly number[], step: number): { parts: number[]; totalCents: number } {
  const sum = partsCents.reduce((s, c) => s + c, 0);
  const totalCents = Math.round(sum / step) * step;
  const parts = partsCents.map((c) => Math.floor(c / step) * step);
  let spare = Math.round((totalCents - parts.reduce((s, c) => s + c, 0)) / step);
  const byRemainder = partsCents.map((c, i) => ({ i, rest: c - parts[i]! })).sort((a, b) => b.rest - a.rest || a.i - b.i);
  for (const { i } of byRemainder) {
    if (spare <= 0) break;
    parts[i]! += step;
    spare -= 1;
  }
  return { parts, totalCents };
}
