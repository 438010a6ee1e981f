import { describe, expect, it } from 'vitest';
import { estimate, parseRateBook, sampleRateBook, type ProjectInput } from './index.ts';

// A realistic picture-frame job, worked by hand: one 12 ft wall of a sitting room with a 36 in
// picture-frame wainscot, demo rate book (invented prices; physical sizes are real conventions).
const rateBook = parseRateBook(sampleRateBook());
const job: ProjectInput = {
  rooms: [
    {
      name: 'Sitting room',
      ceilingHeight: 96,
      walls: [{ label: 'Fireplace wall', length: 144 }],
      treatment: { id: 'picture-frame', height: 'wainscot', wainscotHeight: 36 },
    },
  ],
  builtBefore1978: 'no',
  measuredBy: 'site-measure',
};

describe('picture-frame wainscot on a 12 ft wall', () => {
  const e = estimate(job, rateBook);
  const wall = e.takeoff.rooms[0]!.walls[0]!;

  it('lays four 30 in frames centred in the wall', () => {
    // Band: top of the 5-1/4 in demo baseboard to 36 in = 30.75 in; 144 × 30.75 / 144 = 30.75 sq ft.
    expect(wall.netSqFt).toBeCloseTo(30.75, 9);
    // Frames keep a 4 in margin from baseboard, cap rail and wall ends: they span 9.25 to 32 in high
    // (22.75 in) and a stretch of 144 − 2 × 4 = 136 in. At the 30 in target with 4 in between,
    // ⌊(136 + 4) / (30 + 4)⌋ = 4 frames take 4 × 30 + 3 × 4 = 132 in, 2 in more margin each side.
    expect(wall.frames).toEqual({ count: 4, width: 30, height: 22.75 });
    const frames = wall.pieces.filter((p) => p.role === 'frame');
    expect(frames.map((f) => f.x)).toEqual([6, 40, 74, 108]);
  });

  it('cuts the frame moulding from five 8 ft lengths, an exact layout with no waste added', () => {
    // Source: docs/sources.md §12 — a 45° miter's long point equals the frame's outside size, so each
    // frame is 2 × 30 + 2 × 22.75 in: 16 cuts, 8 of 30 and 8 of 22.75 in, 422 in in all.
    // Lower bound ⌈422 / 96⌉ = 5 lengths. Five do it (1/8 in kerf between cuts, docs/sources.md §12):
    //   30+30+30 (90.25), 30+30+30 (90.25), 30+30+22.75 (83), 4 × 22.75 (91.375), 3 × 22.75 (68.5).
    // 16 cuts is inside the exact search, so no waste factor on top (docs/sources.md §47): 5 bought.
    const line = e.takeoff.materials.find((m) => m.id === 'moulding:frame-moulding')!;
    expect(line).toMatchObject({ cuts: 16, needed: 5, quantity: 5, stockLength: 96 });
    expect(line.basis).toMatch(/exact layout/);
  });

  it('runs the cap rail in two equal cuts with an inch at each end for fitting', () => {
    // Demo trim end allowance 1 in: 144 in will not come from one 96 in length (94 in usable), so two
    // cuts of 144 / 2 + 2 × 1 = 74 in, which cannot share a length (148 > 96): 2 lengths.
    expect(wall.capRailFeet).toBeCloseTo(12, 9);
    const cap = e.takeoff.materials.find((m) => m.id === 'moulding:cap-rail')!;
    expect(cap).toMatchObject({ cuts: 2, quantity: 2 });
  });
});
