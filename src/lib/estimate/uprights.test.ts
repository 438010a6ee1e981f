import { describe, expect, it } from 'vitest';
import { estimate, parseRateBook, sampleRateBook, type ProjectInput } from './index.ts';

const rb = parseRateBook(sampleRateBook());
// Found by the "more wall never costs less" property: a full-height flat-panel wall, 84 in ceiling,
// a 40 in door, an 18 in door at 124 in and three counted doors.
const wall = (length: number): ProjectInput => ({
  rooms: [
    {
      name: 'Hall',
      ceilingHeight: 84,
      walls: [
        {
          length,
          openings: [
            { kind: 'door', width: 40, sillHeight: 0 },
            { kind: 'door', width: 18, height: 24, sillHeight: 0, offset: 124 },
            { kind: 'door', count: 3 },
          ],
        },
      ],
      treatment: { id: 'flat-panel', height: 'full' },
    },
  ],
  builtBefore1978: 'no',
  measuredBy: 'homeowner-estimate',
});

describe('stiles and battens between openings', () => {
  it('never stacks two uprights on one spot, and a longer wall never has fewer', () => {
    const xs = (len: number): number[] =>
      estimate(wall(len), rb)
        .takeoff.rooms[0]!.walls[0]!.pieces.filter((p) => p.role === 'stile')
        .map((p) => p.x);
    const at339 = xs(339);
    const at340 = xs(340);
    expect(new Set(at339).size).toBe(at339.length);
    expect(new Set(at340).size).toBe(at340.length);
    // Before: 12 stiles at 339 in (three pairs stacked on one another) and 11 at 340 in.
    expect(at340.length).toBeGreaterThanOrEqual(at339.length);
    expect(estimate(wall(340), rb).price.totalCents).toBeGreaterThanOrEqual(estimate(wall(339), rb).price.totalCents);
  });

  it('sets an upright against each side of a cased opening, none over it', () => {
    // Door 36 in at 66 in (casing 2-1/4 in, docs/sources.md §30): the casing spans 63.75–104.25 in.
    // The 1x3 batten (2-1/2 in, docs/sources.md §1) left of it stands at 63.75 − 2.5 = 61.25 in, the one
    // right of it at 104.25 in (common practice, no source: battens frame the casing).
    const p: ProjectInput = {
      rooms: [
        {
          name: 'Bedroom',
          ceilingHeight: 96,
          walls: [{ length: 168, openings: [{ kind: 'door', width: 36, height: 80, sillHeight: 0, offset: 66 }] }],
          treatment: { id: 'board-and-batten', height: 'full' },
        },
      ],
      builtBefore1978: 'no',
      measuredBy: 'site-measure',
    };
    const battens = estimate(p, rb).takeoff.rooms[0]!.walls[0]!.pieces.filter((x) => x.role === 'batten');
    const full = battens.filter((b) => b.y < 10).map((b) => b.x);
    expect(full).toContain(61.25);
    expect(full).toContain(104.25);
    expect(full.every((x) => x + 2.5 <= 63.75 + 1e-9 || x >= 104.25 - 1e-9)).toBe(true);
  });
});

describe('uprights under a sill', () => {
  // Found by the property: a 60 in board-and-batten wall with a 24 in tall opening whose sill is at
  // 42 in. Once the band's battens reached past the sill, the stretch under the opening lost its
  // battens (5 → 3), so a 46 in wainscot cost less than a 45 in one. Battens now stand under the sill,
  // shorter (common practice, no source: a bigger job never costs less).
  const passThrough = (wainscotHeight: number): number =>
    estimate(
      {
        rooms: [
          {
            name: 'Kitchen',
            ceilingHeight: 84,
            walls: [{ length: 60, openings: [{ kind: 'door', height: 24, sillHeight: 42 }] }],
            treatment: { id: 'board-and-batten', height: 'wainscot', wainscotHeight },
          },
        ],
        builtBefore1978: 'no',
        measuredBy: 'homeowner-estimate',
        paint: false,
      },
      { ...rb, minimumJobCents: 0 },
    ).price.totalCents;
  it('a 46 in wainscot that rises past the sill costs no less than a 45 in one', () => {
    expect(passThrough(46)).toBeGreaterThanOrEqual(passThrough(45));
  });
});
