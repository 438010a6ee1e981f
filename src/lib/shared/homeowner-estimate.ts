import type { Caution, TreatmentKind, WallPiece, WallTakeoff } from '~/lib/estimate/index.ts';

/** A piece as drawn: boards butted end to end in a course come merged, with the x of each butt joint kept. */
export type DrawnPiece = WallPiece & { joints?: number[] };

/**
 * A wall as the homeowner's view carries it: its takeoff with the pieces its drawing needs, or,
 * past the answer's drawing budget, none (`drawn: false`: the wall is described in words instead).
 */
export type HomeownerWall = Omit<WallTakeoff, 'pieces'> & { pieces: DrawnPiece[]; drawn: boolean };

/**
 * What a homeowner sees of an estimate. The firm's unit rates (price per sheet, labour rate, markup)
 * stay on the server: the homeowner gets the range, group totals, quantities, drawings and cautions.
 */
export type HomeownerEstimate = {
  units: 'imperial' | 'metric';
  currency: string;
  locale: string;
  range: { lowCents: number; highCents: number; text: string };
  /** Why the range is as wide as it is, in plain words. */
  rangeReason: string;
  minimumApplied: boolean;
  /**
   * The middle of the range (the job's own price, or the firm's minimum when that is more), rounded to
   * the range's step; the groups below are rounded to the same step and add up to it exactly.
   */
  middleCents: number;
  /** How the middle of the range adds up. */
  groups: { id: 'materials' | 'labour' | 'extras' | 'tax' | 'minimum'; label: string; cents: number }[];
  extras: string[];
  rooms: { name: string; treatmentName: string; treatmentKind: TreatmentKind; height: 'wainscot' | 'full'; netSqFt: number; walls: HomeownerWall[] }[];
  materials: { label: string; quantity: number; unit: string }[];
  cautions: Caution[];
  notes: string[];
};
