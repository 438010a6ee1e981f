/** Wall geometry: intervals, and where openings and electrical boxes sit on a wall. */
import type { Opening, Wall } from './schemas.ts';
import type { PlacedBox, PlacedOpening } from './types.ts';

export type Interval = readonly [number, number];

// Defaults for openings a homeowner only counts.
// Source: docs/sources.md §7 worked example — a 3'0" × 6'8" door (20 sq ft) and a 3 × 5 ft window (15 sq ft); common practice, no source.
export const DEFAULT_DOOR = { width: 36, height: 80, sillHeight: 0 } as const;
// Window sill at 20 in, so its head lines up with a 6'8" door head at 80 in and stays below an
// 8 ft ceiling: common practice, no source.
export const DEFAULT_WINDOW = { width: 36, height: 60, sillHeight: 20 } as const;

// Electrical box cut-out, a single-gang device box: about 2-1/4 × 3-3/4 in (from memory).
export const BOX_CUTOUT = { width: 2.25, height: 3.75 } as const;
// Source: docs/sources.md §4 — receptacles commonly 12–16 in to the bottom of the box; switches commonly
// 48 in above the finished floor (common practice, not set by the NEC). Used only where a box's
// height was not given.
export const OUTLET_BOTTOM = 12;
export const SWITCH_CENTRE = 48;

const EPS = 1e-9;

/** The parts of `base` not covered by any of `cuts`, dropping slivers shorter than `minLength`. */
export function subtractIntervals(base: Interval, cuts: Interval[], minLength = 0.01): Interval[] {
  let parts: Interval[] = [base];
  for (const [c0, c1] of cuts) {
    const next: Interval[] = [];
    for (const [a, b] of parts) {
      if (c1 <= a + EPS || c0 >= b - EPS) {
        next.push([a, b]);
        continue;
      }
      if (c0 > a) next.push([a, c0]);
      if (c1 < b) next.push([c1, b]);
    }
    parts = next;
  }
  return parts.filter(([a, b]) => b - a >= minLength);
}

/** Length of the overlap of two intervals (0 when they do not overlap). */
export function overlap(a0: number, a1: number, b0: number, b1: number): number {
  return Math.max(0, Math.min(a1, b1) - Math.max(a0, b0));
}

function openingSize(o: Opening): { width: number; height: number; sillHeight: number; assumed: boolean } {
  const d = o.kind === 'door' ? DEFAULT_DOOR : DEFAULT_WINDOW;
  return {
    width: o.width ?? d.width,
    height: o.height ?? d.height,
    sillHeight: o.sillHeight ?? d.sillHeight,
    assumed: o.width === undefined || o.height === undefined || o.sillHeight === undefined,
  };
}

// Room beside a counted opening, from a wall end or the next opening: about a casing's width
// (2-1/4 to 2-1/2 in) and a little to spare, so a 36 in door still fits the 42 in end wall of a
// hallway (common practice, no source).
export const OPENING_SPACING = 3;

type Placed = Omit<PlacedOpening, 'inBand'>;
type Loose = Omit<PlacedOpening, 'inBand' | 'offset'>;

/** Measured openings keep their place; counted ones are listed in the order given, sizes and casings filled in. */
function splitOpenings(openings: Opening[], defaultCasing: number): { fixed: Placed[]; loose: Loose[] } {
  const fixed: Placed[] = [];
  const loose: Loose[] = [];
  for (const o of openings) {
    // Objects written out in full rather than spread: this runs for every wall of every estimate.
    const { width, height, sillHeight, assumed } = openingSize(o);
    const casingWidth = o.casingWidth ?? defaultCasing;
    for (let i = 0; i < o.count; i++) {
      if (o.offset !== undefined && o.count === 1) fixed.push({ kind: o.kind, offset: o.offset, width, height, sillHeight, assumed, casingWidth });
      else loose.push({ kind: o.kind, width, height, sillHeight, assumed: true, casingWidth });
    }
  }
  return { fixed, loose };
}

export type OpeningPlacement = { ok: true; openings: Placed[] } | { ok: false; free: Interval[]; unplaced: Loose[] };

/**
 * Expands counted openings and gives each a place: measured offsets are kept; each counted one goes,
 * in the order given, into the first free stretch (between the wall ends and the measured openings)
 * that holds it with OPENING_SPACING on both sides, OPENING_SPACING after the one before it. Where
 * casings are wider than that, the gap grows so that no casing runs past a wall end or onto its
 * neighbour's casing: the gap between two openings is at least the sum of their casings.
 *
 * The places depend only on the openings, never on the wall's length: a longer wall keeps every
 * opening where it was and only gains wall at its right end, so it never needs less material (spread
 * evenly, an opening would slide along the boards or battens as the wall grows, and a board that was
 * needed beside it could disappear). Not ok when some do not fit; validation refuses such a wall.
 */
export function tryPlaceOpenings(openings: Opening[], wallLength: number, defaultCasing = 0): OpeningPlacement {
  const { fixed, loose } = splitOpenings(openings, defaultCasing);
  const free = subtractIntervals(
    [0, wallLength],
    fixed.map((f) => [f.offset, f.offset + f.width] as const),
    0,
  );
  // The casing of the measured opening that ends (or starts) a free stretch; 0 at a wall end.
  const casingAt = (edge: number, side: 'right' | 'left'): number =>
    Math.max(0, ...fixed.filter((f) => Math.abs((side === 'right' ? f.offset + f.width : f.offset) - edge) < 1e-6).map((f) => f.casingWidth ?? 0));
  const rightCasing = free.map(([, b]) => casingAt(b, 'left'));
  const cursor = free.map(([a]) => a);
  const cursorCasing = free.map(([a]) => casingAt(a, 'right'));
  const gap = (c0: number, c1: number): number => Math.max(OPENING_SPACING, c0 + c1);
  const placed = [...fixed];
  const unplaced: Loose[] = [];
  for (const o of loose) {
    const c = o.casingWidth ?? 0;
    const i = free.findIndex(([, b], k) => cursor[k]! + gap(cursorCasing[k]!, c) + o.width + gap(c, rightCasing[k]!) <= b + EPS);
    if (i < 0) {
      unplaced.push(o);
      continue;
    }
    const offset = cursor[i]! + gap(cursorCasing[i]!, c);
    placed.push({ kind: o.kind, width: o.width, height: o.height, sillHeight: o.sillHeight, assumed: o.assumed, casingWidth: o.casingWidth, offset });
    cursor[i] = offset + o.width;
    cursorCasing[i] = c;
  }
  if (unplaced.length > 0) return { ok: false, free, unplaced };
  return { ok: true, openings: placed.sort((a, b) => a.offset - b.offset) };
}

/** The places of `tryPlaceOpenings` for a wall validation has already accepted. */
export function placeOpenings(openings: Opening[], wallLength: number, defaultCasing = 0): Placed[] {
  const placed = tryPlaceOpenings(openings, wallLength, defaultCasing);
  if (!placed.ok) throw new RangeError('placeOpenings: the openings do not fit on the wall; validate the project first');
  return placed.openings;
}

/**
 * Gives each outlet and switch a place on the wall, spread evenly through the stretches no door or
 * window occupies at box height. `covered` and `capRailCrosses` are filled in by the takeoff.
 */
export function placeBoxes(wall: Wall, wallLength: number, openings: Array<Pick<PlacedOpening, 'offset' | 'width' | 'sillHeight' | 'height'>>): PlacedBox[] {
  const boxes: PlacedBox[] = [];
  const place = (kind: 'outlet' | 'switch', n: number, bottom: number): void => {
    if (n === 0) return;
    const top = bottom + BOX_CUTOUT.height;
    const blocked = openings
      .filter((o) => overlap(o.sillHeight, o.sillHeight + o.height, bottom, top) > 0)
      .map((o) => [o.offset - 2, o.offset + o.width + 2] as const);
    let free = subtractIntervals([0, wallLength], blocked, BOX_CUTOUT.width);
    if (free.length === 0) free = [[0, wallLength]];
    const total = free.reduce((s, [a, b]) => s + (b - a - BOX_CUTOUT.width), 0);
    for (let i = 0; i < n; i++) {
      // Switches sit a little off the outlets' positions so the drawing keeps them apart.
      let at = (total * (i + (kind === 'outlet' ? 0.5 : 0.3))) / n;
      let offset = free[0]![0];
      for (const [a, b] of free) {
        const usable = b - a - BOX_CUTOUT.width;
        if (at <= usable + EPS) {
          offset = a + Math.max(0, at);
          break;
        }
        at -= usable;
      }
      boxes.push({ kind, offset, bottom, width: BOX_CUTOUT.width, height: BOX_CUTOUT.height, covered: false, capRailCrosses: false });
    }
  };
  place('outlet', wall.outlets, OUTLET_BOTTOM);
  place('switch', wall.switches, SWITCH_CENTRE - BOX_CUTOUT.height / 2);
  return boxes;
}
