import { fc, test as fcTest } from '@fast-check/vitest';
import { describe, expect, it } from 'vitest';
import { balancedPositions, balancedRun } from './balanced-run.ts';
import { boardRun } from './board-run.ts';
import { estimate } from './estimate.ts';
import { parseRateBook } from './validate.ts';
import { sampleRateBook } from './sample-data.ts';
import type { ProjectInput, RateBookInput } from './schemas.ts';

describe('balancedRun', () => {
  it('splits a 60 in wall of 5-7/8 in strips into two equal ends', () => {
    // Worked by hand (docs/sources.md §9 strip width, §12 board runs). From the left end: 10 strips
    // and 9 gaps fill 10·5.875 + 9·0.125 = 59.875 in, so an 11th strip would be ripped to
    // 60 − 59.875 − 0.125 = 0 in: no 11th strip, the run ends exactly: last strip 5-7/8 in.
    expect(boardRun(60, 5.875, 0.125)).toEqual({ count: 10, lastWidth: 5.875, leftover: 0.125 });
    // Balanced: fewest middle strips k with e ≤ 5.875: e = (60 − 5.875k − 0.125(k + 1)) / 2.
    // k = 8: e = (60 − 47 − 1.125) / 2 = 5.9375 > 5.875; k = 9: e = (60 − 52.875 − 1.25) / 2 = 2.9375.
    // So 11 boards, both ends 2-15/16 in.
    const r = balancedRun(60, 5.875, 0.125);
    expect(r.count).toBe(11);
    expect(r.endWidth).toBeCloseTo(2.9375, 9);
  });

  it('balances a 12 ft wall of 1x6 boards: 26 boards with 4-7/16 in ends instead of a 3-3/8 in last board', () => {
    // From the left (docs/sources.md §12): 25 boards + gaps = 140.625 in, last board 3-3/8 in.
    expect(boardRun(144, 5.5, 0.125).lastWidth).toBeCloseTo(3.375, 9);
    // Balanced, by hand: k = 24 → e = (144 − 132 − 3.125) / 2 = 4.4375 ≤ 5.5; k = 23 → e = 7.25 > 5.5.
    const r = balancedRun(144, 5.5, 0.125);
    expect(r).toEqual({ count: 26, endWidth: 4.4375 });
  });

  it('lays a run no wider than one board as that board ripped to fit', () => {
    expect(balancedRun(4, 5.5, 0.125)).toEqual({ count: 1, endWidth: 4 });
    expect(balancedPositions(4, 5.5, 0.125)).toEqual([{ start: 0, width: 4 }]);
  });

  // Property (the layout rule itself, common practice, no source): equal ends, never narrower than
  // (w − g)/2, never wider than a board, the run filled exactly, no overlaps.
  fcTest.prop([fc.double({ min: 1, max: 1200, noNaN: true }), fc.double({ min: 0.5, max: 12, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true })], {
    seed: 20261202,
  })('ends are equal and the run is filled', (run, width, gap) => {
    const pos = balancedPositions(run, width, gap);
    const first = pos[0]!;
    const last = pos.at(-1)!;
    expect(first.width).toBeCloseTo(last.width, 9);
    expect(first.width).toBeLessThanOrEqual(width + 1e-9);
    if (run > width) expect(first.width).toBeGreaterThan((width - gap) / 2 - 1e-9);
    expect(last.start + last.width).toBeCloseTo(run, 6);
    for (let i = 1; i < pos.length; i++) expect(pos[i]!.start).toBeCloseTo(pos[i - 1]!.start + pos[i - 1]!.width + gap, 6);
  });

  // A longer run never has fewer boards (the count is what is bought).
  fcTest.prop([fc.double({ min: 1, max: 600, noNaN: true }), fc.double({ min: 0, max: 60, noNaN: true }), fc.double({ min: 0.5, max: 12, noNaN: true })], {
    seed: 20261202,
  })('a longer run never has fewer boards', (run, more, width) => {
    expect(balancedRun(run + more, width, 0.125).count).toBeGreaterThanOrEqual(balancedRun(run, width, 0.125).count);
  });
});

function balancedBook(): RateBookInput {
  const rb = sampleRateBook();
  rb.catalogue.treatments = rb.catalogue.treatments.map((t) => ({ ...t, layout: 'balanced' as const }));
  return rb;
}

function hallway(treatment: string, height: 'wainscot' | 'full'): ProjectInput {
  return {
    rooms: [
      {
        name: 'Hallway',
        ceilingHeight: 96,
        length: 240,
        width: 36,
        walls: [
          { label: 'Left wall', side: 'length' },
          { label: 'Right wall', side: 'length' },
        ],
        treatment: height === 'wainscot' ? { id: treatment, height, wainscotHeight: 36 } : { id: treatment, height },
      },
    ],
    builtBefore1978: 'no',
    measuredBy: 'homeowner-tape',
  };
}

describe('balanced layouts in the takeoff', () => {
  it('lays a 20 ft hallway wall in beadboard with two equal end panels', () => {
    // By hand: 240 in of 48 in panels butted (no gap). From the left: exactly 5 panels, no rip.
    // Balanced: k middle panels with e = (240 − 48k) / 2 ≤ 48 → k = 3 gives e = 48: the same 5 whole
    // panels. The layout only differs where the run does not come out even, so try 234 in: from the
    // left, 4 panels and one ripped to 42 in; balanced, the fewest middle panels with e ≤ 48 is
    // k = ⌈(234 − 96) / 48⌉ = 3, e = (234 − 144) / 2 = 45: two 45 in ends around 3 whole panels.
    const rb = parseRateBook(balancedBook());
    const p = hallway('beadboard', 'wainscot');
    const even = estimate(p, rb).takeoff.rooms[0]!.walls[0]!;
    expect(even.pieces.filter((x) => x.role === 'panel').map((x) => x.width)).toEqual([48, 48, 48, 48, 48]);
    p.rooms[0]!.length = 234;
    const wall = estimate(p, rb).takeoff.rooms[0]!.walls[0]!;
    const panels = wall.pieces.filter((x) => x.role === 'panel');
    expect(panels.map((x) => x.width)).toEqual([45, 48, 48, 48, 45]);
    expect(panels[0]!.ripped).toBe(true);
    expect(panels[2]!.ripped).toBe(false);
  });

  it('gives vertical plywood strips the same width at both ends and says nothing about a thin last strip', () => {
    const rb = parseRateBook(balancedBook());
    const p = hallway('shiplap-vertical-ply', 'full');
    p.rooms[0]!.length = 60;
    const wall = estimate(p, rb).takeoff.rooms[0]!.walls[0]!;
    // As worked above: 11 strips, ends 2-15/16 in.
    expect(wall.boards).toMatchObject({ count: 11, firstWidth: 2.9375, lastWidth: 2.9375 });
    const strips = wall.pieces.filter((x) => x.role === 'strip');
    expect(strips[0]!.width).toBeCloseTo(2.9375, 9);
    expect(strips.at(-1)!.x + strips.at(-1)!.width).toBeCloseTo(60, 9);
    expect(wall.notes.join(' ')).not.toMatch(/ripped to/);
  });

  it('an older rate book (no layout field) still lays boards from the left end', () => {
    const rb = parseRateBook(sampleRateBook());
    const p = hallway('shiplap-vertical-ply', 'full');
    p.rooms[0]!.length = 60;
    const wall = estimate(p, rb).takeoff.rooms[0]!.walls[0]!;
    expect(wall.boards?.firstWidth).toBeUndefined();
    expect(wall.boards?.count).toBe(10);
  });

  // Balanced layouts keep the price monotone on plain walls: a longer wall never costs less.
  const treatments = ['shiplap-vertical-ply', 'shiplap-horizontal', 'beadboard', 'board-and-batten', 'flat-panel'];
  const seed = process.env.MORE_WALL_SEED === 'random' ? {} : { seed: 20261202 };
  fcTest.prop(
    [
      fc.constantFrom(...treatments),
      fc.constantFrom('wainscot' as const, 'full' as const),
      fc.integer({ min: 60, max: 400 }),
      fc.integer({ min: 1, max: 48 }),
      fc.boolean(),
    ],
    { ...seed, numRuns: Number(process.env.MORE_WALL_RUNS ?? 100) },
  )('a longer balanced wall never costs less', (id, height, length, more, door) => {
    const rb = parseRateBook(balancedBook());
    const grow = (len: number): ProjectInput => {
      const p = hallway(id, height);
      p.rooms[0]!.length = len;
      if (door) p.rooms[0]!.walls[0]!.openings = [{ kind: 'door', width: 30, height: 80, sillHeight: 0, offset: 12 }];
      return p;
    };
    const a = grow(length);
    const b = grow(length + more);
    expect(estimate(b, rb).price.totalCents).toBeGreaterThanOrEqual(estimate(a, rb).price.totalCents);
  });
});

describe('a balanced treatment on a stair wall', () => {
  // Found by the "more wall never costs less" property (common practice, no source: a bigger job never
  // costs less): full-height beadboard, balanced, in a room of a plain wall and a wall along a 7-step
  // stair (rise 7 in, run 10 in) from its left end, ceiling 181 in. Balanced, the stair wall's end
  // panels widened from 44-1/2 in to 45-1/2 in as the walls grew from 425 to 427 in, every panel over
  // the stair moved, and the total fell from $6,222.81 to $6,187.72.
  const rb = { ...parseRateBook(balancedBook()), minimumJobCents: 0 };
  const room = (length: number): ProjectInput => ({
    rooms: [
      {
        name: 'Stair hall',
        ceilingHeight: 181,
        walls: [{ length }, { length, stair: { steps: 7, rise: 7, run: 10, startsAt: 'left' } }],
        treatment: { id: 'beadboard', height: 'full' },
      },
    ],
    builtBefore1978: 'no',
    measuredBy: 'homeowner-estimate',
  });
  const panels = (length: number) =>
    estimate(room(length), rb)
      .takeoff.rooms[0]!.walls[1]!.pieces.filter((p) => p.role === 'panel')
      .map((p) => ({ x: p.x, width: p.width, height: Math.round(p.height * 1000) / 1000 }));

  it('sets the panels out from the foot of the stair, full widths first, and says so', () => {
    // Hand-worked: 48 in panels from the foot; the stair runs 7 × 10 = 70 in and climbs 49 in, 0.7 in
    // per inch, over the 5-1/2 in skirt (docs/sources.md §42). Full height to the level 181 in ceiling:
    // 0–48 in from the skirt at its low side, 181 − 5.5 = 175.5 in; 48–96 in from the nosing at 48 in
    // (33.6 in), 141.9 in; beyond the stair's top, 181 − 5.5 − 49 = 126.5 in. At 425 in: eight whole
    // panels and the rip at the far end, 425 − 384 = 41 in; at 427 in, 43 in. The plain wall stays balanced.
    for (const [length, rip] of [
      [425, 41],
      [427, 43],
    ] as const) {
      const p = panels(length);
      expect(p.slice(0, 3)).toEqual([
        { x: 0, width: 48, height: 175.5 },
        { x: 48, width: 48, height: 141.9 },
        { x: 96, width: 48, height: 126.5 },
      ]);
      expect(p).toHaveLength(9);
      expect(p.at(-1)).toEqual({ x: 384, width: rip, height: 126.5 });
    }
    const e = estimate(room(425), rb);
    expect(e.takeoff.rooms[0]!.walls[0]!.pieces.find((p) => p.role === 'panel')!.width).toBe(44.5);
    expect(e.takeoff.notes.some((n) => /Stair hall: Wall 2: along a stair .* set out from the foot of the stair/.test(n))).toBe(true);
  });

  it('so the longer walls cost no less', () => {
    expect(estimate(room(427), rb).price.totalCents).toBeGreaterThanOrEqual(estimate(room(425), rb).price.totalCents);
  });
});
