/**
 * The parts of a wall's takeoff that a stair changes (docs/sources.md §40, §43). The layout is worked
 * in a frame measured up from the nosing line (on the level part beyond the stair, up from the landing),
 * so a raked wainscot is the same level band as on any wall; this module turns lengths in that frame
 * into what is cut: uprights at their long point, runs along the rake at their true length, the rake
 * cuts they take, and the skirt board.
 */
import { rakedSpan } from './stair-checks.ts';
import { stairGeometry, type Stair, type StairGeometry } from './stair-wall.ts';

export interface Rake {
  stair: Stair;
  g: StairGeometry;
  /** Full height: the ceiling is level (the band's top does not follow the rake). */
  full: boolean;
  /** The stretch under the stair, [x0, x1] from the wall's left end. */
  span: [number, number];
}

export function rakeOf(length: number, stair: Stair, full: boolean): Rake {
  return { stair, g: stairGeometry(length, stair), full, span: rakedSpan(length, stair) };
}

const EPS = 1e-9;

function nosingRange(r: Rake, x0: number, x1: number): { lo: number; hi: number } {
  const a = r.g.nosingAt(x0);
  const b = r.g.nosingAt(x1);
  return { lo: Math.min(a, b), hi: Math.max(a, b) };
}

/**
 * The top, in the nosing frame, of a column [x0, x1] whose band top is `top`. A wainscot column is cut
 * at its long point: the rise of the nosing line across its width is added (w × rise / run). A
 * full-height column runs from the band bottom at its low side up to the level ceiling.
 */
export function rakedColumnTop(r: Rake, x0: number, x1: number, top: number): number {
  const { lo, hi } = nosingRange(r, x0, x1);
  return r.full ? top - lo : top + (hi - lo);
}

/**
 * Rake cuts in one layer of columns (sheets, strips or uprights) set `pitch` apart: every column over
 * the stair is cut to the angle, two ends in a wainscot (top and bottom follow the rake), one full
 * height (the ceiling end is square). Counted from the stair's run, ceil(run / pitch) columns, rather
 * than from where the columns happen to land, so a longer wall never has fewer (docs/sources.md §43).
 */
export function columnRakeCuts(r: Rake, pitch: number): number {
  const run = r.span[1] - r.span[0];
  return Math.ceil(run / pitch - 1e-9) * (r.full ? 1 : 2);
}

/**
 * Columns set out from the foot of the stair: from the left end as planned when the stair starts
 * there, mirrored when it starts at the right end. Anchored at the foot, the columns over the stair
 * stay where they are as the wall grows; the ripped column goes to the far end.
 */
export function footFirst<T extends { start: number; width: number }>(r: Rake | undefined, length: number, positions: T[]): T[] {
  if (!r || r.stair.startsAt === 'left') return positions;
  return positions.map((p) => ({ ...p, start: length - p.start - p.width }));
}

/** Height of the nosing line under the low side of [x0, x1]: lifts a piece from the nosing frame to the wall for drawings. */
export function liftAt(r: Rake, x0: number, x1: number): number {
  return nosingRange(r, x0, x1).lo;
}

/** The nosing line's length from the wall's left end to x: along the rake over the stair, level beyond. */
export function developed(r: Rake, x: number): number {
  const [a, b] = r.span;
  const k = Math.hypot(r.stair.rise, r.stair.run) / r.stair.run;
  const under = Math.max(0, Math.min(x, b) - a);
  return x + under * (k - 1);
}

/** The x whose developed length is u (the inverse of `developed`). */
export function undeveloped(r: Rake, u: number): number {
  const [a, b] = r.span;
  const k = Math.hypot(r.stair.rise, r.stair.run) / r.stair.run;
  if (u <= a) return u;
  if (u <= a + (b - a) * k) return a + (u - a) / k;
  return u - (b - a) * (k - 1);
}

/**
 * Rake cuts for a run [x0, x1] that follows the nosing line (a rail, a cap rail, a course of boards):
 * one at the foot, where it is cut plumb, and two at the top, where it turns level in an angled joint
 * (or meets the wall's end and is fitted there). Counted the same wherever the stair ends, so more steps
 * never count fewer (common practice, no source; docs/sources.md §43).
 */
export function runRakeCuts(r: Rake, x0: number, x1: number): number {
  const [a, b] = r.span;
  return Math.min(x1, b) - Math.max(x0, a) > EPS ? 3 : 0;
}
