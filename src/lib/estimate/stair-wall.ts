/**
 * A wall along a stair: the line of nosings climbs from the stair's start end over `steps × run` and
 * the rest of the wall is level at the top. The covered band follows that line (docs/sources.md §40).
 * Pure geometry and checks; the takeoff uses them through stair-takeoff.ts and stair-checks.ts.
 */
import { z } from 'zod';
import { formatLength, type Units } from './units.ts';

export const STAIR_STARTS = ['left', 'right'] as const;

/** Hard limits refuse only absurd values; the code limits are a note (stairNotes), not a refusal. */
export const stairSchema = z.strictObject({
  /** Rise-and-run steps whose nosings run along this wall (13 risers to a landing: 12). */
  steps: z.number().int({ error: 'Number of steps must be a whole number.' }).min(1).max(30, { error: 'Number of steps must be at most 30.' }),
  rise: z.number({ error: 'Riser height must be a number (in).' }).min(3, { error: 'Riser height must be at least 3 in.' }).max(12),
  run: z.number({ error: 'Tread depth must be a number (in).' }).min(6, { error: 'Tread depth must be at least 6 in.' }).max(24),
  startsAt: z.enum(STAIR_STARTS).default('left'),
});
export type Stair = z.output<typeof stairSchema>;

export interface Point {
  x: number;
  y: number;
}

/** The stair on one wall, in wall coordinates (x from the wall's left end, y up from the floor at the stair's foot). */
export interface StairGeometry {
  /** Horizontal length the stair takes: steps × run. */
  runLength: number;
  /** Height the nosing line climbs: steps × rise. */
  climb: number;
  /** Rake angle in radians: atan(rise / run). */
  angle: number;
  /** The nosing line's two ends (low end first). */
  rake: [Point, Point];
  /** Height of the nosing line at x (level at `climb` beyond the stair). */
  nosingAt(x: number): number;
}

export function stairGeometry(wallLength: number, stair: Stair): StairGeometry {
  const runLength = stair.steps * stair.run;
  const climb = stair.steps * stair.rise;
  const angle = Math.atan(stair.rise / stair.run);
  const slope = stair.rise / stair.run;
  const fromStart = (x: number): number => (stair.startsAt === 'left' ? x : wallLength - x);
  const nosingAt = (x: number): number => Math.min(climb, Math.max(0, fromStart(x)) * slope);
  const low = stair.startsAt === 'left' ? 0 : wallLength;
  const high = stair.startsAt === 'left' ? runLength : wallLength - runLength;
  return {
    runLength,
    climb,
    angle,
    rake: [
      { x: low, y: 0 },
      { x: high, y: climb },
    ],
    nosingAt,
  };
}

/** Length of the nosing line across a wall: along the rake over the stair, level beyond (a rail or course that follows it). */
export function nosingLineLength(wallLength: number, stair: Stair): number {
  const run = Math.min(wallLength, stair.steps * stair.run);
  return wallLength - run + (run * Math.hypot(stair.rise, stair.run)) / stair.run;
}

/** Skirt board length along the rake: steps × √(rise² + run²). Source: docs/sources.md §40 (Pythagoras). */
export function skirtLength(stair: Stair): number {
  return stair.steps * Math.hypot(stair.rise, stair.run);
}

/**
 * Covered area (sq in) of the band on a stair wall. Bottom: `skirt` above the nosing line. Top: `wainscot`
 * above the nosing line, or the level ceiling for full height. A band of constant vertical height H is a
 * parallelogram over the stair and a rectangle beyond: H × wall length.
 */
export function rakedBandArea(wallLength: number, g: StairGeometry, skirt: number, top: { wainscot: number } | { ceiling: number }): number {
  if ('wainscot' in top) return Math.max(0, top.wainscot - skirt) * wallLength;
  // Full height: the ceiling stays level; the bottom edge is a triangle of height `climb` over the stair, then level.
  const underNosing = (g.climb * g.runLength) / 2 + g.climb * (wallLength - g.runLength);
  return Math.max(0, (top.ceiling - skirt) * wallLength - underNosing);
}

/**
 * A vertical member (batten, stile, vertical board) of width w at x on a stair wall, cut to the rake: its
 * length at the long point and how many rake cuts it takes (two in a raked wainscot, one for full height,
 * none on the level part).
 */
export function rakedUpright(
  g: StairGeometry,
  x: number,
  w: number,
  skirt: number,
  top: { wainscot: number } | { ceiling: number },
): { longPoint: number; rakeCuts: number } {
  const a = g.nosingAt(x);
  const b = g.nosingAt(x + w);
  const lo = Math.min(a, b);
  const hi = Math.max(a, b);
  const raked = hi - lo > 1e-9;
  if ('wainscot' in top) return { longPoint: top.wainscot - skirt + (hi - lo), rakeCuts: raked ? 2 : 0 };
  return { longPoint: top.ceiling - (lo + skirt), rakeCuts: raked ? 1 : 0 };
}

/** Least band left above the top of the stair for a full-height wall (common practice, no source). */
export const MIN_BAND_ABOVE_STAIR = 12;

/** Field-level errors (path relative to the wall) for a stair that cannot be on this wall. */
export function stairErrors(
  wallName: string,
  wallLength: number,
  stair: Stair,
  units: Units,
  band: { skirt: number; ceiling: number; full: boolean; wainscot: number },
): Record<string, string> {
  const len = (x: number): string => formatLength(x, units);
  const errors: Record<string, string> = {};
  const g = stairGeometry(wallLength, stair);
  if (g.runLength > wallLength + 1e-9) {
    errors['stair.steps'] = `${wallName}: ${stair.steps} steps of ${len(stair.run)} take ${len(g.runLength)}, more than the wall's ${len(wallLength)}.`;
  }
  const topOfBand = band.full ? band.ceiling : g.climb + band.wainscot;
  if (band.full && g.climb + band.skirt + MIN_BAND_ABOVE_STAIR > band.ceiling) {
    errors['stair.rise'] =
      `${wallName}: the stair climbs ${len(g.climb)}, which leaves less than ${len(MIN_BAND_ABOVE_STAIR)} of covered wall under the ${len(band.ceiling)} ceiling.`;
  } else if (!band.full && topOfBand > band.ceiling) {
    errors['stair.rise'] = `${wallName}: the wainscot at the top of the stair would reach ${len(topOfBand)}, above the ${len(band.ceiling)} ceiling.`;
  }
  return errors;
}

/** Takeoff notes where the stair is outside the code limits. Source: docs/sources.md §41 (IRC R311.7.5). */
export function stairNotes(wallName: string, stair: Stair, units: Units): string[] {
  const len = (x: number): string => formatLength(x, units);
  const notes: string[] = [];
  // Source: docs/sources.md §41 — IRC R311.7.5.1 riser at most 7-3/4 in; R311.7.5.2 tread at least 10 in.
  if (stair.rise > 7.75)
    notes.push(`${wallName}: a riser of ${len(stair.rise)} is taller than the ${len(7.75)} the residential code allows; check the stair before trimming it.`);
  if (stair.run < 10)
    notes.push(`${wallName}: a tread of ${len(stair.run)} is shallower than the ${len(10)} the residential code asks for; check the stair before trimming it.`);
  return notes;
}
