/**
 * Fixtures that take wall length (tub, shower, vanity, toilet, radiator, built-in cabinet): their
 * default sizes, whether the treatment stops at them or goes behind them, and where they sit.
 */
import { OPENING_SPACING, subtractIntervals, type Interval } from './geometry.ts';
import type { FixtureKind, Wall } from './schemas.ts';
import type { PlacedFixture } from './types.ts';

/**
 * Per kind: default width and height (in), whether the treatment stops at the fixture or goes behind
 * it once the fixture is taken off and set back, and how much of the band a stopping fixture blocks.
 * Sizes from memory (common stock sizes): a 60 in tub about 20 in tall, a 36 in shower stall, a 30 in
 * vanity at 34 in counter height, a toilet about 20 in wide by 30 in to the tank top, a 36 × 24 in
 * radiator, a 36 in built-in cabinet 84 in tall. See docs/sources.md §20.
 */
export const FIXTURE_TABLE: Record<FixtureKind, { width: number; height: number; placement: 'stops' | 'behind'; blocks: 'band' | 'height'; name: string }> = {
  // A tub or shower: the band is not covered over its whole length (the wet zone, docs/sources.md §20).
  tub: { width: 60, height: 20, placement: 'stops', blocks: 'band', name: 'tub' },
  shower: { width: 36, height: 80, placement: 'stops', blocks: 'band', name: 'shower' },
  // A vanity or built-in stays; the treatment is scribed to it and not covered up to its height.
  vanity: { width: 30, height: 34, placement: 'stops', blocks: 'height', name: 'vanity' },
  'built-in': { width: 36, height: 84, placement: 'stops', blocks: 'height', name: 'built-in cabinet' },
  // A toilet or radiator comes off, the treatment goes on behind it, and it is set back.
  toilet: { width: 20, height: 30, placement: 'behind', blocks: 'height', name: 'toilet' },
  radiator: { width: 36, height: 24, placement: 'behind', blocks: 'height', name: 'radiator' },
};

/** Labour per fixture when the rate book gives none (demo-sized, common practice, no source). */
export const DEFAULT_HOURS_PER_FIXTURE: Record<FixtureKind, number> = {
  tub: 0.5,
  shower: 0.5,
  vanity: 0.75,
  'built-in': 0.75,
  toilet: 1.5,
  radiator: 2,
};

const EPS = 1e-9;

type Fixture = Wall['fixtures'][number];
type Loose = Omit<PlacedFixture, 'offset'>;

function sized(f: Fixture): Loose {
  const d = FIXTURE_TABLE[f.kind];
  return {
    kind: f.kind,
    width: f.width ?? d.width,
    height: f.height ?? d.height,
    placement: d.placement,
    assumed: f.width === undefined || f.height === undefined || f.offset === undefined,
  };
}

export type FixturePlacement = { ok: true; fixtures: PlacedFixture[] } | { ok: false; free: Interval[]; unplaced: Loose[] };

/**
 * Places fixtures beside the wall's openings (already placed): measured offsets are kept; the others
 * go, in the order given, into the first free stretch that holds them, tight against a wall end (a tub
 * or vanity sits in the corner) and OPENING_SPACING clear of an opening or another fixture. Like the
 * openings, the places never depend on the wall's length beyond the stretch that holds them.
 */
export function tryPlaceFixtures(fixtures: Fixture[], wallLength: number, openings: Array<{ offset: number; width: number }>): FixturePlacement {
  const fixed = fixtures.filter((f) => f.offset !== undefined).map((f) => ({ ...sized(f), offset: f.offset! }));
  const loose = fixtures.filter((f) => f.offset === undefined).map(sized);
  const blocked: Interval[] = [...openings.map((o) => [o.offset, o.offset + o.width] as const), ...fixed.map((f) => [f.offset, f.offset + f.width] as const)];
  const free = subtractIntervals([0, wallLength], blocked, 0);
  const cursor = free.map(([a]) => a);
  const placed: PlacedFixture[] = [...fixed];
  const unplaced: Loose[] = [];
  for (const f of loose) {
    const gapBefore = (k: number): number => (cursor[k]! <= EPS ? 0 : OPENING_SPACING);
    const gapAfter = (b: number): number => (b >= wallLength - EPS ? 0 : OPENING_SPACING);
    const i = free.findIndex(([, b], k) => cursor[k]! + gapBefore(k) + f.width + gapAfter(b) <= b + EPS);
    if (i < 0) {
      unplaced.push(f);
      continue;
    }
    const offset = cursor[i]! + gapBefore(i);
    placed.push({ ...f, offset });
    cursor[i] = offset + f.width;
  }
  if (unplaced.length > 0) return { ok: false, free, unplaced };
  return { ok: true, fixtures: placed.sort((a, b) => a.offset - b.offset) };
}

/** Field errors for a wall's fixtures (paths under `wp`), with lengths written by `len`. */
export function fixtureProblems(
  fixtures: Fixture[],
  wallLength: number,
  openings: Array<{ offset: number; width: number }>,
  wp: string,
  len: (x: number) => string,
): Record<string, string> {
  const out: Record<string, string> = {};
  const spans: Array<{ a: number; b: number; i: number }> = [];
  fixtures.forEach((f, i) => {
    const s = sized(f);
    const fp = `${wp}.fixtures.${i}`;
    if (s.width > wallLength) out[`${fp}.width`] = `The ${FIXTURE_TABLE[f.kind].name} (${len(s.width)} wide) is wider than the ${len(wallLength)} wall.`;
    else if (f.offset !== undefined) {
      if (f.offset + s.width > wallLength + 1e-6)
        out[`${fp}.offset`] = `The ${FIXTURE_TABLE[f.kind].name} runs past the wall's end (${len(f.offset)} + ${len(s.width)} > ${len(wallLength)}).`;
      else if (openings.some((o) => Math.min(o.offset + o.width, f.offset! + s.width) - Math.max(o.offset, f.offset!) > 1e-6))
        out[`${fp}.offset`] = `The ${FIXTURE_TABLE[f.kind].name} overlaps a door or window on this wall.`;
      else spans.push({ a: f.offset, b: f.offset + s.width, i });
    }
  });
  spans.sort((x, y) => x.a - y.a);
  for (let k = 1; k < spans.length; k++) {
    if (spans[k]!.a < spans[k - 1]!.b - 1e-6) out[`${wp}.fixtures.${spans[k]!.i}.offset`] = 'This fixture overlaps another fixture on the same wall.';
  }
  if (Object.keys(out).length > 0) return out;
  const placement = tryPlaceFixtures(fixtures, wallLength, openings);
  if (!placement.ok) {
    const names = placement.unplaced.map((f) => `a ${FIXTURE_TABLE[f.kind].name} ${len(f.width)} wide`).join(', ');
    const free = placement.free.filter(([a, b]) => b - a >= 0.01).map(([a, b]) => len(b - a));
    out[`${wp}.fixtures`] =
      `The fixtures without a distance from the left end do not fit on this ${len(wallLength)} wall beside its doors, windows and other fixtures: no room for ${names} (each needs ${len(OPENING_SPACING)} clear of an opening or another fixture; the free stretches are ${free.join(', ') || 'none'}). Give each fixture its distance from the left end, or check the sizes.`;
  }
  return out;
}

/**
 * The part of the wall a stopping fixture keeps the treatment off, as an opening-like rectangle from
 * the floor: the whole height for a tub or shower, the fixture's own height for a vanity or built-in.
 * Fixtures the treatment goes behind block nothing.
 */
export function blockedBy(f: PlacedFixture, ceilingHeight: number): { offset: number; width: number; sillHeight: number; height: number } | undefined {
  if (f.placement !== 'stops') return undefined;
  const height = FIXTURE_TABLE[f.kind].blocks === 'band' ? ceilingHeight : f.height;
  return { offset: f.offset, width: f.width, sillHeight: 0, height };
}
