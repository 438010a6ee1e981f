import { fc, test as fcTest } from '@fast-check/vitest';
import { describe, expect, it } from 'vitest';
import { estimate, parseRateBook, projectSize, sampleRateBook, takeoff, validateProject, type ProjectInput } from './index.ts';
import { fieldsOf } from './input-refusal.testing.ts';

const rateBook = parseRateBook(sampleRateBook());
const catalogue = rateBook.catalogue;

// The stair on these walls: 13 risers of 7-1/2 in to the landing, so 12 treads of 10 in whose nosings
// run along the wall from its left end. Source: docs/sources.md §40 — run 12 × 10 = 120 in, climb
// 12 × 7.5 = 90 in, rake atan(7.5 / 10) ≈ 36.87°, tan θ = 0.75, along the rake √(7.5² + 10²) = 12.5 in per step.
const stair = { steps: 12, rise: 7.5, run: 10 };

function stairHall(treatment: string, height: 'wainscot' | 'full', wall: Record<string, unknown> = {}, room: Record<string, unknown> = {}): ProjectInput {
  return {
    rooms: [
      {
        name: 'Stair hall',
        // From the floor at the stair's foot to the ceiling over the landing (an invented stairwell).
        ceilingHeight: 204,
        walls: [{ label: 'Stair wall', length: 168, stair, ...wall }],
        treatment: { id: treatment, height, ...(height === 'wainscot' ? { wainscotHeight: 36 } : {}) },
        ...room,
      },
    ],
    builtBefore1978: 'no',
    measuredBy: 'site-measure',
  } as ProjectInput;
}

describe('a stair wall in board and batten, wainscot 36 in above the nosing (hand-worked)', () => {
  // The 14 ft (168 in) wall; a 1x6 skirt board (5-1/2 in dressed, docs/sources.md §42, DOC PS 20) on the
  // stair, so the band runs from 5-1/2 in to 36 in above the nosing line: 30-1/2 in tall everywhere.
  const e = estimate(stairHall('board-and-batten', 'wainscot'), rateBook);
  const wall = e.takeoff.rooms[0]!.walls[0]!;
  const heights = (role: string): number[] => wall.pieces.filter((p) => p.role === role).map((p) => Math.round(p.height * 1000) / 1000);

  it('covers the band that follows the nosing line', () => {
    // Source: docs/sources.md §40 — a band of constant vertical height is a parallelogram: 30.5 × 168 = 5124 sq in ≈ 35.58 sq ft.
    expect(wall.grossSqFt).toBeCloseTo(5124 / 144, 6);
    expect(wall.netSqFt).toBeCloseTo(5124 / 144, 6);
    expect(wall.rake).toEqual([
      { x: 0, y: 0 },
      { x: 120, y: 90 },
    ]);
  });

  it('cuts backing sheets and battens at their long point', () => {
    // Backing columns of the 48 in sheet from the left: 0–48 and 48–96 climb 48 × 0.75 = 36 in → 30.5 + 36 = 66.5 in;
    // 96–144 climbs from 72 to the top of the stair at 90 → 30.5 + 18 = 48.5 in; 144–168 is level → 30.5 in.
    expect(heights('panel')).toEqual([66.5, 66.5, 48.5, 30.5]);
    // Battens (1x3, 2-1/2 in) under the 1x4 top rail (3-1/2 in): 36 − 3.5 − 5.5 = 27 in square. From the
    // stair's foot at the 16 in spacing, the eight that start on the 120 in stair (0, 16 … 112; the last
    // ends at 114.5) take 2.5 × 0.75 = 1.875 in more: 28.875 in. The level rest, 128–168 in, is spread
    // evenly: ceil((40 − 2.5) / 16) + 1 = 4 at 128, 140.5, 153 and 165.5 in, 27 in each.
    expect(heights('batten')).toEqual([...Array(8).fill(28.875), ...Array(4).fill(27)]);
    expect(wall.pieces.filter((p) => p.role === 'batten').map((p) => p.x)).toEqual([0, 16, 32, 48, 64, 80, 96, 112, 128, 140.5, 153, 165.5]);
  });

  it('runs the top rail and the cap rail along the rake at their true length', () => {
    // Along the nosing line: 120 × 12.5 / 10 = 150 in over the stair + 48 in level = 198 in = 16.5 ft.
    expect(wall.capRailFeet).toBeCloseTo(16.5, 9);
    const rail = wall.pieces.filter((p) => p.role === 'rail');
    const railCut = e.takeoff.materials.find((m) => m.id === 'board:mdf-1x4-8');
    expect(rail.reduce((s, p) => s + p.width, 0)).toBeCloseTo(168, 6);
    expect(railCut).toBeDefined();
  });

  it('counts the skirt board and the rake cuts, and prices them', () => {
    // Skirt: 12 × 12.5 = 150 in = 12.5 ft, one piece of the 16 ft board; level baseboard only on the last 48 in.
    expect(wall.skirtFeet).toBeCloseTo(12.5, 9);
    expect(wall.baseboardFeet).toBeCloseTo(4, 9);
    const skirt = e.takeoff.materials.find((m) => m.label.startsWith('1x6 pine skirt board'));
    expect(skirt?.quantity).toBe(1);
    // Rake cuts: backing 3 columns × 2 = 6; battens 8 × 2 = 16; top rail and cap rail each 1 at the foot's
    // wall end + 2 where they turn level = 3 + 3; skirt 2 → 30.
    expect(wall.rakeCuts).toBe(30);
    const cuts = e.price.labour.find((l) => l.task === 'rake-cuts');
    expect(cuts?.hours).toBeCloseTo(30 * rateBook.labour.hoursPerRakeCut, 9);
    expect(e.price.labour.find((l) => l.task === 'skirt-board')?.hours).toBeCloseTo(
      12.5 * (rateBook.labour.hoursPerFootBaseboardRemoved + rateBook.labour.hoursPerFootBaseboardInstalled),
      1,
    );
  });

  it('gives no code note for a stair inside the code limits', () => {
    // Source: docs/sources.md §41 — IRC R311.7.5: 7-1/2 in ≤ 7-3/4 in and 10 in ≥ 10 in.
    expect(e.takeoff.notes.some((n) => /residential code/.test(n))).toBe(false);
  });
});

describe('battens over a stair stay where they are as the wall grows', () => {
  // Found by the "more wall never costs less" property (common practice, no source: a bigger job never
  // costs less): a board-and-batten wainscot 24 in high in a room of a plain 67 in wall and a 67 in wall
  // along a 6-step stair (rise 6 in, run 9 in). Spread evenly, the stair wall's six battens moved apart
  // as the wall grew, and the fifth slid off the top of the stair: its long point fell from 16.6 to
  // 16.067 in, the twelve batten cuts fitted two 8 ft lengths instead of three, and the total fell
  // from $707.38 at 67 in to $701.70 at 68 in.
  const room = (length: number, startsAt: 'left' | 'right' = 'left'): ProjectInput => ({
    rooms: [
      {
        name: 'Test room',
        ceilingHeight: 120,
        walls: [
          { length, outlets: 0 },
          { length, outlets: 0, stair: { steps: 6, rise: 6, run: 9, startsAt } },
        ],
        treatment: { id: 'board-and-batten', height: 'wainscot', wainscotHeight: 24 },
      },
    ],
    builtBefore1978: 'no',
    measuredBy: 'homeowner-estimate',
  });
  const noMinimum = { ...rateBook, minimumJobCents: 0 };
  const battens = (e: ReturnType<typeof estimate>, wall: number) =>
    e.takeoff.rooms[0]!.walls[wall]!.pieces.filter((p) => p.role === 'batten').map((p) => ({ x: p.x, height: Math.round(p.height * 1000) / 1000 }));

  it('sets them out from the foot of the stair at the batten spacing, the level rest spread evenly', () => {
    // Hand-worked. The stair runs 6 × 9 = 54 in and climbs 6/9 in per inch. Battens (1x3, 2-1/2 in,
    // docs/sources.md §42) stand on the 1x6 skirt (5-1/2 in) under the 1x4 top rail (3-1/2 in):
    // 24 − 3.5 − 5.5 = 15 in square; over the stair 2.5 × 6/9 = 1-2/3 in more, 16.667 in at the long
    // point. From the foot at the 16 in spacing: 0, 16, 32 and 48 in start on the stair (48 + 2.5 = 50.5
    // is still on it). The level rest starts at the next pitch, 64 in: 3 in at 67 in and 4 in at 68 in,
    // no more than two battens wide, so one batten at 64 in, 15 in long. The same five at both lengths.
    for (const length of [67, 68]) {
      expect(battens(estimate(room(length), noMinimum), 1)).toEqual([
        { x: 0, height: 16.667 },
        { x: 16, height: 16.667 },
        { x: 32, height: 16.667 },
        { x: 48, height: 16.667 },
        { x: 64, height: 15 },
      ]);
    }
  });

  it('so the longer wall costs no less', () => {
    // Batten cuts at both lengths: the plain wall's six (ceil((67 − 2.5) / 16) + 1 = 6) of
    // 24 − 3.5 − 5.25 (baseboard) = 15.25 in, and the stair wall's 4 × 16.667 + 15 in: 173.17 in with
    // eleven 1/8 in kerfs, two 8 ft lengths (computed here).
    const [at67, at68] = [estimate(room(67), noMinimum), estimate(room(68), noMinimum)];
    for (const e of [at67, at68]) expect(e.takeoff.materials.find((m) => m.id === 'board:mdf-1x3-8')?.quantity).toBe(2);
    expect(at67.price.totalCents).toBe(69869);
    expect(at68.price.totalCents).toBe(70170);
  });

  it('mirrors the layout for a stair that starts at the right end', () => {
    // The same battens measured from the right end: x = 67 − s − 2.5 for s = 0, 16, 32, 48, 64.
    expect(battens(estimate(room(67, 'right'), noMinimum), 1).map((b) => b.x)).toEqual([64.5, 48.5, 32.5, 16.5, 0.5]);
  });
});

describe('horizontal boards beyond a door on the landing are joined on the studs of the wall', () => {
  // Found by the "more wall never costs less" property (common practice, no source: a longer stair never
  // costs less in a wainscot): horizontal shiplap 24 in high in a room of a plain 292 in wall and a 292 in
  // wall along a stair from its left end (rise 6 in, run 10 in) with a 32 in door on the landing at
  // 72-1/4 in. The courses beyond the door were laid out along the nosing line, so their studs moved
  // with the stair's length; with 6 steps instead of 4 the 30 board cuts fitted 24 lengths instead of
  // 25 and the total fell from $1,950.75 to $1,934.72.
  const room = (steps: number): ProjectInput => ({
    rooms: [
      {
        name: 'Test room',
        ceilingHeight: 120,
        walls: [
          { length: 292, outlets: 0 },
          {
            length: 292,
            outlets: 0,
            stair: { steps, rise: 6, run: 10, startsAt: 'left' },
            openings: [{ kind: 'door', width: 32, height: 24, sillHeight: 0, offset: 72.25 }],
          },
        ],
        treatment: { id: 'shiplap-horizontal', height: 'wainscot', wainscotHeight: 24 },
      },
    ],
    builtBefore1978: 'no',
    measuredBy: 'homeowner-estimate',
    paint: false,
  });
  const noMinimum = { ...rateBook, minimumJobCents: 0 };
  const beyondDoor = (steps: number): number[][] => {
    const boards = estimate(room(steps), noMinimum).takeoff.rooms[0]!.walls[1]!.pieces.filter((p) => p.role === 'board' && p.x >= 106.5 - 1e-9);
    const rows = [...new Set(boards.map((p) => p.y))];
    return rows.map((y) => boards.filter((p) => p.y === y).map((p) => Math.round(p.width * 1000) / 1000));
  };

  it('the same courses beyond the door whatever the length of the stair', () => {
    // Hand-worked. The door's casing (2-1/4 in, docs/sources.md §30) stops the courses at 106.5 in. Studs
    // 16 in apart from the wall's left end (docs/sources.md §45); 8 ft boards: from 106.5 in the farthest
    // stud in reach is 192 in (85.5 in), then 288 in (96 in) and the last 4 in. The next course keeps off
    // the joint at 192 in: 176 in (69.5 in), 272 in (96 in), 20 in. Before, measured along the nosing line,
    // the run began 40 × (√136 / 10 − 1) = 6.65 in further on with 4 steps and 9.97 in with 6.
    const courses = [
      [85.5, 96, 4],
      [69.5, 96, 20],
      [85.5, 96, 4],
      [69.5, 96, 20],
    ];
    expect(beyondDoor(4)).toEqual(courses);
    expect(beyondDoor(6)).toEqual(courses);
  });

  it('so two more steps cost no less', () => {
    expect(estimate(room(6), noMinimum).price.totalCents).toBeGreaterThanOrEqual(estimate(room(4), noMinimum).price.totalCents);
  });
});

describe('a full-height stair wall in vertical plywood strips', () => {
  const t = takeoff(stairHall('shiplap-vertical-ply', 'full'), catalogue);
  const wall = t.rooms[0]!.walls[0]!;
  it('covers the wall from the skirt to the level ceiling', () => {
    // Source: docs/sources.md §40 — (204 − 5.5) × 168 = 33,348 sq in, less under the nosing line
    // 90 × 120 / 2 = 5,400 and 90 × 48 = 4,320: 23,628 sq in ≈ 164.08 sq ft.
    expect(wall.grossSqFt).toBeCloseTo(23628 / 144, 6);
  });
  it('cuts one end of each strip on the rake to the angle', () => {
    // Strips 5-7/8 in at a 6 in pitch: those starting at 0, 6 … 114 (20) cross the rake, one rake cut each; skirt 2.
    expect(wall.rakeCuts).toBe(22);
    // The first strip runs from the skirt at its low side to the ceiling: 204 − 5.5 = 198.5 in, in two lengths.
    const first = wall.pieces.filter((p) => p.x === 0);
    expect(first.reduce((s, p) => s + p.height, 0)).toBeCloseTo(198.5, 6);
  });
  it('shows the caution for work over a stair', () => {
    const c = t.cautions.find((x) => x.id === 'stair');
    expect(c?.text).toMatch(/stair platform/);
    expect(c?.text).toMatch(/local codes/);
  });
});

describe('stair walls: checks and notes', () => {
  it('older projects without a stair validate as before', () => {
    const p = stairHall('beadboard', 'wainscot');
    delete (p.rooms[0]!.walls[0] as Record<string, unknown>).stair;
    expect(validateProject(p, catalogue).rooms[0]!.walls[0]!.stair).toBeUndefined();
  });

  it('refuses a stair whose run is longer than the wall, naming the wall in the project units', () => {
    const f = fieldsOf(() => validateProject(stairHall('beadboard', 'wainscot', { length: 100 }), catalogue));
    expect(f['rooms.0.walls.0.stair.steps']).toBe(`Stair hall, Stair wall: 12 steps of 10" take 10', more than the wall's 8' 4".`);
    const m = fieldsOf(() => validateProject(stairHall('beadboard', 'wainscot', { length: 100 }), catalogue, undefined, 'metric'));
    expect(m['rooms.0.walls.0.stair.steps']).toMatch(/mm|cm|m\b/);
  });

  it('refuses picture-frame moulding on a stair wall and says why', () => {
    const f = fieldsOf(() => validateProject(stairHall('picture-frame', 'wainscot'), catalogue));
    expect(f['rooms.0.walls.0.stair']).toMatch(/not priced online/);
  });

  it('refuses a window or a fixture over the stair, and accepts one on the level part', () => {
    const over = fieldsOf(() =>
      validateProject(stairHall('beadboard', 'wainscot', { openings: [{ kind: 'window', width: 30, height: 40, sillHeight: 30, offset: 20 }] }), catalogue),
    );
    expect(over['rooms.0.walls.0.openings']).toMatch(/^Stair hall, Stair wall: a window at 1' 8" would sit over the stair/);
    // 125 in less its 2-1/4 in casing is 122.75 in, past the stair's 120 in.
    expect(() =>
      validateProject(stairHall('beadboard', 'wainscot', { openings: [{ kind: 'window', width: 30, height: 40, sillHeight: 30, offset: 125 }] }), catalogue),
    ).not.toThrow();
    const fixture = fieldsOf(() => validateProject(stairHall('beadboard', 'wainscot', { fixtures: [{ kind: 'radiator' }] }), catalogue));
    expect(fixture['rooms.0.walls.0.fixtures']).toMatch(/over the stair/);
  });

  it('refuses horizontal boards to the ceiling on a stair wall, and accepts them as a wainscot', () => {
    const f = fieldsOf(() => validateProject(stairHall('shiplap-horizontal', 'full'), catalogue));
    expect(f['rooms.0.walls.0.stair']).toMatch(/^Stair hall, Stair wall: horizontal boards to the ceiling/);
    expect(() => validateProject(stairHall('shiplap-horizontal', 'wainscot'), catalogue)).not.toThrow();
  });

  it('refuses a door on the landing that would reach above the ceiling', () => {
    // The landing is 90 in above the foot: an 80 in door there tops out at 170 in, under a 204 in ceiling but over a 160 in one.
    const door = { openings: [{ kind: 'door', width: 30, height: 80, sillHeight: 0, offset: 130 }] };
    expect(() => validateProject(stairHall('beadboard', 'wainscot', door), catalogue)).not.toThrow();
    const f = fieldsOf(() => validateProject(stairHall('beadboard', 'wainscot', door, { ceilingHeight: 160 }), catalogue));
    expect(f['rooms.0.walls.0.openings.0.height']).toMatch(/landing/);
  });

  it('notes a stair outside the code limits without refusing it', () => {
    // Source: docs/sources.md §41 — IRC R311.7.5.1 riser ≤ 7-3/4 in, R311.7.5.2 tread ≥ 10 in.
    const t = takeoff(stairHall('beadboard', 'wainscot', { stair: { steps: 12, rise: 8, run: 9 } }), catalogue);
    expect(t.notes.filter((n) => /residential code/.test(n))).toHaveLength(2);
  });

  it('a window on the landing stands on the landing', () => {
    // Sill 30 in above the landing, which is the stair's climb (90 in) above the foot: drawn at 120 in.
    const t = takeoff(stairHall('beadboard', 'wainscot', { openings: [{ kind: 'window', width: 30, height: 40, sillHeight: 30, offset: 125 }] }), catalogue);
    const w = t.rooms[0]!.walls[0]!;
    expect(w.openings[0]!.sillHeight).toBe(120);
    // It reaches into the band (5.5–36 in above the landing) from 30 in: a return, and its area comes off.
    expect(w.returns).toBe(1);
    expect(w.openingsSqFt).toBeGreaterThan(0);
  });
});

describe('the size check sees a stair wall coming', () => {
  const treatments = ['shiplap-vertical-ply', 'shiplap-horizontal', 'board-and-batten', 'beadboard', 'flat-panel'] as const;
  // The check must count ahead at least the pieces the takeoff lays (project-size.ts), stair walls included.
  fcTest.prop(
    [
      fc.record({
        steps: fc.integer({ min: 1, max: 30 }),
        rise: fc.integer({ min: 3, max: 12 }),
        run: fc.integer({ min: 6, max: 24 }),
        extra: fc.integer({ min: 0, max: 480 }),
        treatment: fc.constantFrom(...treatments),
        wainscotHeight: fc.integer({ min: 24, max: 48 }),
      }),
    ],
    { numRuns: 60, seed: 20261202 },
  )('counts at least the pieces the takeoff lays', (c) => {
    const length = Math.min(1200, Math.max(12, c.steps * c.run + c.extra));
    // The wainscot at the top of the stair must stay under the 240 in ceiling (else the stair is refused).
    fc.pre(c.steps * c.rise + c.wainscotHeight <= 240 && c.steps * c.run <= length);
    const p = validateProject(
      {
        rooms: [
          {
            name: 'Stair hall',
            ceilingHeight: 240,
            walls: [{ length, stair: { steps: c.steps, rise: c.rise, run: c.run } }],
            treatment: { id: c.treatment, height: 'wainscot', wainscotHeight: c.wainscotHeight },
          },
        ],
        builtBefore1978: 'no',
        measuredBy: 'homeowner-tape',
      },
      catalogue,
    );
    const laid = takeoff(p, catalogue).rooms[0]!.walls[0]!.pieces.length;
    expect(projectSize(p, catalogue).rooms[0]!.pieces).toBeGreaterThanOrEqual(laid);
  });
});
