import { fc, test as fcTest } from '@fast-check/vitest';
import { describe, expect, it } from 'vitest';
import { fromStairFoot, spreadEvenly } from './upright-positions.ts';

describe('upright positions', () => {
  it('spreads a level stretch evenly, one at each end', () => {
    // 168 in, 2-1/2 in battens at most 16 in apart: ceil(165.5 / 16) + 1 = 12, 165.5 / 11 = 15.045 in apart (computed here).
    const xs = spreadEvenly(0, 168, 2.5, 16);
    expect(xs).toHaveLength(12);
    expect(xs[1]).toBeCloseTo(165.5 / 11, 9);
    expect(xs.at(-1)).toBeCloseTo(165.5, 9);
  });

  it('sets the stretch that holds a stair out from its foot', () => {
    // A 54 in stair on a 100 in wall, 16 in spacing: 0, 16, 32, 48 over the stair; the level rest
    // 64–100 in spread evenly, ceil((36 − 2.5) / 16) + 1 = 4, 11.167 in apart (computed here).
    const xs = fromStairFoot(0, 100, 2.5, 16, 54, 'left');
    expect(xs.slice(0, 5)).toEqual([0, 16, 32, 48, 64]);
    expect(xs).toHaveLength(8);
    expect(xs.at(-1)).toBeCloseTo(97.5, 9);
    // From the right end: the same distances from the foot, mirrored.
    expect(fromStairFoot(0, 100, 2.5, 16, 54, 'right').slice(0, 5)).toEqual([97.5, 81.5, 65.5, 49.5, 33.5]);
  });

  it('puts one against a stretch end that comes before the next pitch, where it clears the last one', () => {
    // 54 in stair: the level rest would start at 64 in. A 66 in stretch leaves 2 in there, so one goes
    // against the end at 63.5 in. Where the stair fills a 51 in stretch, the batten at 48 in (to 50.5 in)
    // fits and one at the end (48.5 in) would overlap it, so the last 1/2 in stays open; in a 49 in
    // stretch the batten at 48 in would stick out, and the one against the end at 46.5 in takes its place.
    expect(fromStairFoot(0, 66, 2.5, 16, 54, 'left')).toEqual([0, 16, 32, 48, 63.5]);
    expect(fromStairFoot(0, 51, 2.5, 16, 51, 'left')).toEqual([0, 16, 32, 48]);
    expect(fromStairFoot(0, 49, 2.5, 16, 49, 'left')).toEqual([0, 16, 32, 46.5]);
  });

  // Property (common practice, no source): a longer stretch keeps every upright set at the pitch over
  // the stair where it was. Only one set against the stretch's end moves, and it stands over the stair
  // only where the stretch ends less than an upright's width past the stair's top.
  fcTest.prop([fc.integer({ min: 6, max: 300 }), fc.integer({ min: 0, max: 300 }), fc.integer({ min: 1, max: 60 }), fc.integer({ min: 6, max: 48 })], {
    numRuns: 200,
    seed: 20261203,
  })('a longer stretch moves no upright over the stair', (run, extra, more, spacing) => {
    const before = fromStairFoot(0, run + extra, 2.5, spacing, run, 'left').filter((x) => x % spacing === 0 && x < run);
    const after = fromStairFoot(0, run + extra + more, 2.5, spacing, run, 'left');
    for (const x of before) expect(after).toContain(x);
  });
});
