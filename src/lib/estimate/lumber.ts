/**
 * Nominal softwood lumber names and their actual dressed sizes.
 * Source: American Softwood Lumber Standard, DOC PS 20 — minimum dressed sizes, dry (≤19 % MC),
 * as reproduced by "Softwood Lumber - Standard Sizes" (engineeringtoolbox.com) and sizes.com.
 * Rule visible in the table: 1-in boards dress to 3/4 in; nominal 2–6 in lose 1/2 in, 8 in and wider lose 3/4 in.
 */
export const DRESSED_SIZES = {
  '1x2': { thickness: 0.75, width: 1.5 },
  '1x3': { thickness: 0.75, width: 2.5 },
  '1x4': { thickness: 0.75, width: 3.5 },
  '1x6': { thickness: 0.75, width: 5.5 },
  '1x8': { thickness: 0.75, width: 7.25 },
  '1x10': { thickness: 0.75, width: 9.25 },
  '1x12': { thickness: 0.75, width: 11.25 },
  '2x2': { thickness: 1.5, width: 1.5 },
  '2x4': { thickness: 1.5, width: 3.5 },
  '2x6': { thickness: 1.5, width: 5.5 },
} as const satisfies Record<string, { thickness: number; width: number }>;

export type NominalSize = keyof typeof DRESSED_SIZES;
export const NOMINAL_SIZES = Object.keys(DRESSED_SIZES) as NominalSize[];

/** Actual dressed thickness and width in inches of a nominal size such as `1x6`. */
export function dressedSize(nominal: NominalSize): { thickness: number; width: number } {
  const size = DRESSED_SIZES[nominal];
  if (!size) throw new RangeError(`Unknown nominal lumber size "${String(nominal)}"; expected one of ${NOMINAL_SIZES.join(', ')}`);
  return { ...size };
}
