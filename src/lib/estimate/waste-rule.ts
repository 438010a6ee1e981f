/**
 * When the waste factor is added. A quantity that comes from an exact cutting layout already counts
 * every offcut and kerf, so adding the waste factor on top would buy offcuts twice; only the catalogue's
 * (smaller) defect allowance is added to it, so an owner can still buy a spare. A quantity that is an
 * estimate (a heuristic layout, or fractions of sheets shared between piece sizes) keeps the waste
 * factor, never less than the defect allowance, so an estimate never comes out below the exact figure
 * it stands for.
 */

const EPS = 1e-9;

export interface Allowances {
  /** The catalogue's waste factor (fraction), for estimated quantities. */
  waste: number;
  /** The catalogue's defect allowance (fraction), for exact quantities. */
  defect: number;
}

/** Whole units to buy for an exact need: the need plus the defect allowance, rounded up. */
export function exactQuantity(needed: number, a: Allowances): number {
  return Math.ceil(needed * (1 + a.defect) - EPS);
}

/** Whole units to buy for an estimated need: plus the waste factor (at least the defect allowance). */
export function estimatedQuantity(needed: number, a: Allowances): number {
  return Math.ceil(needed * (1 + Math.max(a.waste, a.defect)) - EPS);
}

export interface SheetCount {
  quantity: number;
  /** Always false: sheet counts add fractions of per-size layouts (see sheetQuantity). */
  exact: boolean;
  /** Sheets each size fills on its own. */
  wholeSheets: number;
  /** Sheet fractions left over by sizes that do not fill a whole sheet, summed. */
  mixedFraction: number;
  /** How many sizes leave a part-filled sheet. */
  partSizes: number;
}

/**
 * Sheets to buy for pieces grouped by size, each size at its own best layout (`perSheet` pieces per
 * sheet), the sizes' fractions of a sheet added up as if they shared sheets. That sum is an estimate
 * of a mixed layout, so sheets always keep the waste factor, and never come out below the sheets each
 * size fills plus its remainders rounded up together. A count that were called exact only when one
 * size happened to be left over would drop its waste as a wall grew past the point where a ripped
 * column disappears, and a longer wall could then cost less.
 */
export function sheetQuantity(groups: Array<{ count: number; perSheet: number }>, a: Allowances): SheetCount {
  let wholeSheets = 0;
  let mixedFraction = 0;
  let partSizes = 0;
  for (const g of groups) {
    const per = Math.max(1, g.perSheet);
    const whole = Math.floor(g.count / per + EPS);
    const rest = g.count - whole * per;
    wholeSheets += whole;
    if (rest > EPS) {
      partSizes += 1;
      mixedFraction += rest / per;
    }
  }
  const rounded = exactQuantity(wholeSheets + Math.ceil(mixedFraction - EPS), a);
  return { quantity: Math.max(rounded, estimatedQuantity(wholeSheets + mixedFraction, a)), exact: false, wholeSheets, mixedFraction, partSizes };
}
