/** Consumables by coverage: paint and primer gallons, caulk and adhesive tubes. */
import { CUBIC_IN_PER_FL_OZ, CUBIC_IN_PER_GALLON } from './units.ts';

/** Gallons of paint or primer for an area and number of coats, before rounding up to whole gallons. */
export function gallonsFor(sqFt: number, coats: number, sqFtPerGallon: number): number {
  if (!(sqFtPerGallon > 0)) throw new RangeError('gallonsFor: coverage must be positive');
  return (Math.max(0, sqFt) * Math.max(0, coats)) / sqFtPerGallon;
}

/** Whole gallons to buy: `ceil(area × coats ÷ coverage)`. */
export function gallonsToBuy(sqFt: number, coats: number, sqFtPerGallon: number): number {
  return Math.ceil(gallonsFor(sqFt, coats, sqFtPerGallon) - 1e-9);
}

/**
 * Theoretical coverage of a coating, sq ft per US gallon: one gallon (231 in³) spread 1 mil thick
 * covers 231 / 0.001 / 144 = 1604.2 sq ft; scaled by volume solids and divided by the dry film.
 */
export function theoreticalCoverage(volumeSolids: number, dryMils: number): number {
  return ((CUBIC_IN_PER_GALLON / 0.001 / 144) * volumeSolids) / dryMils;
}

/** Feet of caulk per tube for a rectangular joint `width` × `depth` inches. */
export function caulkFeetPerTube(fluidOunces: number, width: number, depth: number): number {
  return (fluidOunces * CUBIC_IN_PER_FL_OZ) / (width * depth * 12);
}

/** Feet of caulk per tube for a triangular fillet with legs `leg` inches (the usual bead at a trim edge). */
export function filletFeetPerTube(fluidOunces: number, leg: number): number {
  return (fluidOunces * CUBIC_IN_PER_FL_OZ) / (((leg * leg) / 2) * 12);
}

/** Feet of round bead per tube of `diameter` inches (construction adhesive). */
export function beadFeetPerTube(fluidOunces: number, diameter: number): number {
  return (fluidOunces * CUBIC_IN_PER_FL_OZ) / (((Math.PI * diameter * diameter) / 4) * 12);
}
