import { fc, test as fcTest } from '@fast-check/vitest';
import { describe, expect, it } from 'vitest';
import { FIXTURE_KINDS } from './schemas.ts';
import { estimate, EstimateInputError, formatMoney, parseRateBook, projectSchema, sampleProject, sampleRateBook, type ProjectInput } from './index.ts';
import { fieldsOf } from './input-refusal.testing.ts';

const rateBook = parseRateBook(sampleRateBook());

function oneWall(length: number, treatment: string, height: 'wainscot' | 'full', extra: Partial<ProjectInput> = {}, outlets = 1): ProjectInput {
  return {
    rooms: [
      {
        name: 'Test room',
        ceilingHeight: 96,
        walls: [{ length, outlets, openings: [{ kind: 'window', width: 30, height: 48, sillHeight: 30, offset: 10 }] }],
        treatment: { id: treatment, height },
      },
    ],
    builtBefore1978: 'no',
    measuredBy: 'homeowner-tape',
    ...extra,
  };
}

describe('estimate of the sample project (invented demo data)', () => {
  const e = estimate(sampleProject(), sampleRateBook());

  it('is plain JSON that survives a round trip', () => {
    expect(JSON.parse(JSON.stringify(e))).toEqual(e);
  });

  it('adds up: every price line is quantity × unit price, and the lines make the total', () => {
    const p = e.price;
    for (const l of p.lines.filter((x) => x.group === 'materials' || x.group === 'extras')) expect(l.totalCents).toBe(l.quantity * l.unitCents);
    for (const l of p.lines) expect(Number.isInteger(l.totalCents)).toBe(true);
    expect(p.lines.reduce((s, l) => s + l.totalCents, 0)).toBe(p.totalCents);
    expect(p.lowCents).toBeLessThanOrEqual(p.totalCents);
    expect(p.highCents).toBeGreaterThanOrEqual(p.totalCents);
    expect(p.lowCents % rateBook.roundingCents).toBe(0);
    expect(p.highCents % rateBook.roundingCents).toBe(0);
  });

  it('says where each number came from', () => {
    for (const l of e.price.lines) expect(l.basis.length).toBeGreaterThan(5);
    for (const m of e.takeoff.materials) expect(m.basis.length).toBeGreaterThan(5);
    expect(e.price.spread.basis).toMatch(/tape measure, with photos/);
  });

  it('takes off each wall: net = gross − openings, a cut-out and an extender per covered box', () => {
    for (const room of e.takeoff.rooms) {
      for (const w of room.walls) {
        expect(w.netSqFt).toBeCloseTo(w.grossSqFt - w.openingsSqFt, 9);
        expect(w.cutOuts).toBe(w.boxes.filter((b) => b.covered).length);
      }
    }
    const extenders = e.takeoff.materials.find((m) => m.id === 'box-extenders');
    expect(extenders?.quantity).toBe(e.takeoff.cutOuts);
  });

  it('gives the vertical shiplap wall its board count and last board', () => {
    const bed = e.takeoff.rooms[1]!.walls[0]!;
    // 150 in of 5-7/8 in strips with 1/8 in gaps: 25 strips use 149.875 in (computed here).
    expect(bed.boards).toMatchObject({ count: 25, lastWidth: 5.875 });
    // Source: docs/sources.md §9 — 5-7/8 in strips with a 1/8 in kerf: 8 from a 48 in sheet width.
    expect(e.takeoff.materials.find((m) => m.id === 'sheet:ply-4x8-quarter')?.piecesPerSheet).toBe(8);
  });

  it('formats money with Intl in the firm currency', () => {
    expect(formatMoney(435000, 'USD', 'en-US')).toBe('$4,350.00');
    expect(formatMoney(435000, 'EUR', 'de-DE')).toMatch(/4\.350,00/);
    expect(e.price.rangeText).toMatch(/^\$[\d,]+ – \$[\d,]+$/);
  });
});

describe('cautions', () => {
  const ids = (p: ProjectInput): string[] => estimate(p, rateBook).takeoff.cautions.map((c) => c.id);

  // Source: NEC 314.20 (docs/sources.md §4) — a combustible (wood) finish needs boxes flush: any box under the finish → extender.
  it('asks for box extenders and the breaker when boxes sit under a wood finish', () => {
    expect(ids(oneWall(120, 'shiplap-vertical-ply', 'wainscot'))).toContain('electrical-boxes');
    expect(ids(oneWall(120, 'shiplap-vertical-ply', 'wainscot', {}, 0))).not.toContain('electrical-boxes');
    const c = estimate(oneWall(120, 'beadboard', 'wainscot'), rateBook).takeoff.cautions.find((x) => x.id === 'electrical-boxes')!;
    expect(c.text).toMatch(/breaker/);
    expect(c.text).toMatch(/licensed electrician/);
  });

  // Source: EPA RRP rule, 40 CFR 745 (docs/sources.md §5) — pre-1978 or not sure → lead-safe caution.
  it('adds lead-safe practices for homes built before 1978 or when not sure', () => {
    expect(ids(oneWall(120, 'beadboard', 'wainscot', { builtBefore1978: 'yes' }))).toContain('lead-safe');
    expect(ids(oneWall(120, 'beadboard', 'wainscot', { builtBefore1978: 'not-sure' }))).toContain('lead-safe');
    expect(ids(oneWall(120, 'beadboard', 'wainscot', { builtBefore1978: 'no' }))).not.toContain('lead-safe');
  });

  // Source: docs/sources.md §5 — removing 60 ft of 5.5 in painted baseboard disturbs 27.5 sq ft (> 6 sq ft) → RRP applies; 12 ft → 5.5 sq ft (minor repair).
  it('charges lead-safe set-up when removed painted baseboard passes 6 sq ft in a room', () => {
    const p = (len: number): ProjectInput => ({
      ...oneWall(len, 'beadboard', 'wainscot', { builtBefore1978: 'yes' }),
      rooms: [{ ...oneWall(len, 'beadboard', 'wainscot').rooms[0]!, replaceBaseboard: true, walls: [{ length: len }] }],
    });
    const big = estimate(p(60 * 12), rateBook);
    expect(big.takeoff.rooms[0]!.disturbedPaintSqFt).toBeCloseTo((720 * 5.25) / 144, 9);
    expect(big.price.lines.some((l) => l.label === 'Lead-safe set-up')).toBe(true);
    const small = estimate(p(12 * 12), rateBook);
    expect(small.takeoff.rooms[0]!.disturbedPaintSqFt).toBeLessThanOrEqual(6);
    expect(small.price.lines.some((l) => l.label === 'Lead-safe set-up')).toBe(false);
  });

  // Source: IRC R307.2 and MDF industry guidance (docs/sources.md §10) — damp rooms: moisture-resistant materials, no wood in the wet zone.
  it('warns about moisture in damp rooms and ladders for full height', () => {
    const damp = oneWall(120, 'beadboard', 'wainscot');
    damp.rooms[0]!.damp = true;
    expect(ids(damp)).toEqual(expect.arrayContaining(['damp-room', 'wet-zone']));
    expect(ids(oneWall(120, 'beadboard', 'full'))).toContain('ladder');
    expect(ids(oneWall(120, 'beadboard', 'wainscot'))).not.toContain('ladder');
  });

  it('every caution defers to codes or licensed professionals', () => {
    const p = oneWall(120, 'shiplap-vertical-ply', 'full', { builtBefore1978: 'yes' });
    p.rooms[0]!.damp = true;
    for (const c of estimate(p, rateBook).takeoff.cautions) {
      expect(c.text).toMatch(/code|licensed|rules|certified/i);
    }
  });
});

describe('bad input is refused with the field named', () => {
  it('refuses negative and absurd lengths', () => {
    const p = oneWall(120, 'beadboard', 'wainscot') as any;
    p.rooms[0].walls[0].length = -5;
    expect(fieldsOf(() => estimate(p, rateBook))).toEqual({ 'rooms.0.walls.0.length': 'Wall length must be at least 12 in.' });
    p.rooms[0].walls[0].length = 1e9;
    expect(fieldsOf(() => estimate(p, rateBook))['rooms.0.walls.0.length']).toMatch(/at most 1200 in/);
    p.rooms[0].walls[0].length = Number.NaN;
    expect(fieldsOf(() => estimate(p, rateBook))['rooms.0.walls.0.length']).toMatch(/Wall length/);
  });

  it('refuses an opening bigger than its wall or taller than the ceiling', () => {
    const p = oneWall(120, 'beadboard', 'wainscot') as any;
    p.rooms[0].walls[0].openings[0] = { kind: 'door', width: 130, height: 100, sillHeight: 0 };
    const f = fieldsOf(() => estimate(p, rateBook));
    expect(f['rooms.0.walls.0.openings.0.width']).toMatch(/more than the wall is long/);
    expect(f['rooms.0.walls.0.openings.0.height']).toMatch(/above the ceiling/);
  });

  it('refuses an unknown or switched-off treatment', () => {
    expect(fieldsOf(() => estimate(oneWall(120, 'marble-slab', 'wainscot'), rateBook))['rooms.0.treatment.id']).toMatch(/Unknown treatment "marble-slab"/);
    const rb = sampleRateBook();
    rb.catalogue.treatments[3]!.enabled = false;
    expect(fieldsOf(() => estimate(oneWall(120, 'beadboard', 'wainscot'), rb))['rooms.0.treatment.id']).toMatch(/does not offer/);
  });

  it('refuses unknown keys, unknown trip zones and a broken rate book', () => {
    const p = { ...oneWall(120, 'beadboard', 'wainscot'), colour: 'red' };
    expect(fieldsOf(() => estimate(p, rateBook))).toHaveProperty('colour');
    expect(fieldsOf(() => estimate({ ...oneWall(120, 'beadboard', 'wainscot'), tripZone: 'mars' }, rateBook))).toHaveProperty('tripZone');
    const rb = sampleRateBook() as any;
    rb.catalogue.capRailId = 'nothing';
    rb.labour.rateCents = -1;
    const f = fieldsOf(() => estimate(oneWall(120, 'beadboard', 'wainscot'), rb));
    expect(f['rateBook.catalogue.capRailId']).toMatch(/No moulding/);
    expect(f['rateBook.labour.rateCents']).toMatch(/cannot be negative/);
  });

  it('the project schema is strict and fills defaults', () => {
    const parsed = projectSchema.parse(oneWall(120, 'beadboard', 'wainscot'));
    expect(parsed.paint).toBe(false);
    expect(parsed.rooms[0]!.walls[0]!.switches).toBe(0);
  });
});

describe('properties of the price', () => {
  const treatments = ['shiplap-vertical-ply', 'shiplap-horizontal', 'board-and-batten', 'beadboard', 'flat-panel', 'picture-frame'] as const;
  const arb = fc.record({
    length: fc.integer({ min: 60, max: 480 }),
    more: fc.integer({ min: 1, max: 240 }),
    treatment: fc.constantFrom(...treatments),
    height: fc.constantFrom('wainscot' as const, 'full' as const),
    outlets: fc.integer({ min: 0, max: 4 }),
    paint: fc.boolean(),
    measuredBy: fc.constantFrom('homeowner-estimate' as const, 'homeowner-tape' as const, 'site-measure' as const),
    photos: fc.integer({ min: 0, max: 3 }),
  });

  // Doors and windows as a homeowner gives them: counted or measured, sized or left to the defaults.
  const opening = fc.record(
    {
      kind: fc.constantFrom('door' as const, 'window' as const),
      count: fc.integer({ min: 1, max: 3 }),
      width: fc.integer({ min: 18, max: 72 }),
      height: fc.integer({ min: 24, max: 84 }),
      sillHeight: fc.integer({ min: 0, max: 48 }),
      offset: fc.integer({ min: 0, max: 300 }),
      // A casing of its own, else the rate book's (docs/sources.md §30).
      casingWidth: fc.integer({ min: 0, max: 4 }),
    },
    { requiredKeys: ['kind'] },
  );
  // Fixtures that take wall length (docs/sources.md §20), sized and placed or left to the defaults.
  const fixture = fc.record(
    {
      kind: fc.constantFrom(...FIXTURE_KINDS),
      width: fc.integer({ min: 12, max: 72 }),
      offset: fc.integer({ min: 0, max: 300 }),
    },
    { requiredKeys: ['kind'] },
  );
  // Doors and windows on the level part of a stair wall, each given its distance from the stair's top
  // (or from the one before it): they must stay off the stair in every variant (docs/sources.md §43).
  const stairOpening = fc.record(
    {
      kind: fc.constantFrom('door' as const, 'window' as const),
      width: fc.integer({ min: 18, max: 48 }),
      height: fc.integer({ min: 24, max: 84 }),
      sillHeight: fc.integer({ min: 0, max: 48 }),
      gap: fc.integer({ min: 0, max: 48 }),
      casingWidth: fc.option(fc.integer({ min: 0, max: 4 }), { nil: undefined }),
    },
    { requiredKeys: ['kind', 'width', 'height', 'sillHeight', 'gap'] },
  );
  const grown = fc.record({
    length: fc.integer({ min: 60, max: 480 }),
    // Mostly an inch or two: the steps where a layout re-divides are narrow.
    more: fc.oneof(fc.integer({ min: 1, max: 2 }), fc.integer({ min: 1, max: 240 })),
    ceiling: fc.integer({ min: 84, max: 144 }),
    taller: fc.oneof(fc.integer({ min: 0, max: 2 }), fc.integer({ min: 0, max: 24 })),
    wainscotHeight: fc.option(fc.integer({ min: 24, max: 48 }), { nil: undefined }),
    walls: fc.integer({ min: 1, max: 4 }),
    moreWalls: fc.integer({ min: 0, max: 2 }),
    openings: fc.array(opening, { maxLength: 3 }),
    fixtures: fc.array(fixture, { maxLength: 2 }),
    treatment: fc.constantFrom(...treatments),
    // Boards, strips and panels balanced between the wall's ends instead of laid from the left end.
    balanced: fc.boolean(),
    height: fc.constantFrom('wainscot' as const, 'full' as const),
    outlets: fc.integer({ min: 0, max: 4 }),
    paint: fc.boolean(),
    measuredBy: fc.constantFrom('homeowner-estimate' as const, 'homeowner-tape' as const, 'site-measure' as const),
    photos: fc.integer({ min: 0, max: 3 }),
    moreOutlets: fc.integer({ min: 1, max: 3 }),
    // Sometimes one more wall along a stair (docs/sources.md §40), and a stair with more steps.
    stair: fc.option(
      fc.record({
        steps: fc.integer({ min: 1, max: 8 }),
        rise: fc.integer({ min: 5, max: 7 }),
        run: fc.integer({ min: 9, max: 12 }),
        startsAt: fc.constantFrom('left' as const, 'right' as const),
      }),
      { nil: undefined },
    ),
    moreSteps: fc.integer({ min: 1, max: 2 }),
    stairOpenings: fc.array(stairOpening, { maxLength: 2 }),
  });
  type Grown = typeof grown extends fc.Arbitrary<infer T> ? T : never;
  // The stair wall's openings, measured from its left end on the drawn wall and kept there in every
  // variant: past the top of the longest stair for a stair from the left end, before it from the right.
  const stairWallOpenings = (c: Grown): ProjectInput['rooms'][number]['walls'][number]['openings'] => {
    if (!c.stair) return [];
    const longestRun = (c.stair.steps + c.moreSteps) * c.stair.run;
    const fromLeft = c.stair.startsAt === 'right';
    let edge = fromLeft ? c.length - longestRun : longestRun;
    return c.stairOpenings.map(({ gap, ...o }) => {
      const casing = o.casingWidth ?? rateBook.catalogue.casing.width;
      const offset = fromLeft ? edge - gap - casing - o.width : edge + gap + casing;
      edge = fromLeft ? offset - casing : offset + o.width + casing;
      // On the landing of the longest stair its top stays under the ceiling (the room is that much taller).
      return { ...o, height: Math.min(o.height, c.ceiling - o.sillHeight), offset };
    });
  };
  const room = (
    c: Grown,
    length: number,
    ceilingHeight: number,
    walls: number,
    more: { wainscot?: number; outlets?: number; steps?: number } = {},
  ): ProjectInput => ({
    rooms: [
      {
        name: 'Test room',
        // A room with a stair is as much taller as the longest stair climbs, in every variant alike, so
        // the band still fits over the top of the stair (at most 144 + 24 + 10 × 7 = 238 in).
        ceilingHeight: ceilingHeight + (c.stair ? (c.stair.steps + c.moreSteps) * c.stair.rise : 0),
        // The first wall carries the openings; the others are plain walls of the same length, and the
        // stair, when there is one, runs along a wall of its own after them.
        walls: [
          ...Array.from({ length: walls }, (_, i) => ({
            length,
            outlets: c.outlets + (more.outlets ?? 0),
            openings: i === 0 ? c.openings.map((o) => ({ ...o, ...(o.offset !== undefined ? { count: 1 } : {}) })) : [],
            fixtures: i === 0 ? c.fixtures : [],
          })),
          ...(c.stair
            ? [
                {
                  length,
                  outlets: c.outlets + (more.outlets ?? 0),
                  stair: { ...c.stair, steps: c.stair.steps + (more.steps ?? 0) },
                  openings: stairWallOpenings(c),
                },
              ]
            : []),
        ],
        treatment: {
          id: c.treatment,
          height: c.height,
          ...(c.height === 'wainscot' && c.wainscotHeight !== undefined ? { wainscotHeight: c.wainscotHeight + (more.wainscot ?? 0) } : {}),
        },
      },
    ],
    builtBefore1978: 'no',
    measuredBy: c.measuredBy,
    paint: c.paint,
    photoCount: c.photos,
  });
  // Without a minimum job, which would hide most small jobs' differences.
  const noMinimum = { ...rateBook, minimumJobCents: 0 };
  const balancedBook = {
    ...noMinimum,
    catalogue: { ...noMinimum.catalogue, treatments: noMinimum.catalogue.treatments.map((t) => ({ ...t, layout: 'balanced' as const })) },
  };
  const priced = (p: ProjectInput, balanced = false) => {
    try {
      return estimate(p, balanced ? balancedBook : noMinimum).price;
    } catch (e) {
      if (e instanceof EstimateInputError) return undefined;
      throw e;
    }
  };

  // Property (common practice, no source): more wall never costs less — a longer wall, a taller one
  // (a higher ceiling), or more walls, for every treatment and height, with doors and windows
  // measured or only counted. `MORE_WALL_RUNS=5000 MORE_WALL_SEED=random` explores further.
  // The default seed is fixed. Long random runs found cut lists of more than 20 rails, stiles or
  // boards whose heuristic count fell by one as a wall grew an inch (flat-panel 263 → 264 in, horizontal
  // shiplap 360 → 361 in); stock-cutting.ts now searches those exactly. Battens and stiles moved off
  // the openings they landed on stacked up and came and went with the wall's length (flat-panel
  // 339 → 340 in with five doors); they are now laid per stretch between openings. Random runs after
  // those fixes: 10,000 clean with the default wainscot height, one counterexample left: a picture-frame
  // wainscot whose band rose past a window's sill re-divided its frames around the window and lost one
  // (ceiling 114 → 116 in, sill at 34 in); frames are now laid under each sill (picture-frame.test.ts).
  // Stair walls: battens re-spread over a stair (67 → 68 in), balanced panels on a stair wall and
  // courses beyond a door on the landing measured along the rake are fixed (stair-takeoff.test.ts,
  // balanced-run.test.ts). Left: with a stair from the right end and doors on the landing, backing
  // sheets set out from the foot slide past the doors as the wall grows (full-height flat panel,
  // 408 → 409 in, one sheet fewer), found after 1,662 random runs.
  // CI stays on a fixed seed.
  const moreWallSeed = process.env.MORE_WALL_SEED === 'random' ? undefined : Number(process.env.MORE_WALL_SEED ?? 20261202);
  fcTest.prop([grown], { numRuns: Number(process.env.MORE_WALL_RUNS ?? 120), ...(moreWallSeed === undefined ? {} : { seed: moreWallSeed }) })(
    'more wall never costs less',
    (c) => {
      const a = priced(room(c, c.length, c.ceiling, c.walls), c.balanced);
      fc.pre(a !== undefined);
      for (const bigger of [
        room(c, c.length + c.more, c.ceiling, c.walls),
        room(c, c.length, c.ceiling + c.taller, c.walls),
        room(c, c.length, c.ceiling, c.walls + c.moreWalls),
        room(c, c.length + c.more, c.ceiling + c.taller, c.walls + c.moreWalls),
        // More outlets on every wall.
        room(c, c.length, c.ceiling, c.walls, { outlets: c.moreOutlets }),
        // More steps along a stair wall, where they still fit the wall and the ceiling. Only for a
        // wainscot: to the ceiling, a longer stair leaves less wall to cover, and rightly costs less.
        ...(c.stair && c.height === 'wainscot' && (c.stair.steps + c.moreSteps) * c.stair.run <= c.length
          ? [room(c, c.length, c.ceiling, c.walls, { steps: c.moreSteps })]
          : []),
        // A taller given wainscot (the same as the ceiling's own when none is given).
        room(c, c.length, c.ceiling, c.walls, { wainscot: c.taller }),
      ]) {
        const b = priced(bigger, c.balanced);
        // Every opening that fits a wall fits a longer, taller one.
        expect(b, JSON.stringify(bigger.rooms[0]!.walls.map((w) => [w.length, w.stair?.steps]))).toBeDefined();
        expect(b!.totalCents).toBeGreaterThanOrEqual(a!.totalCents);
        expect(b!.lowCents).toBeGreaterThanOrEqual(a!.lowCents);
        expect(b!.highCents).toBeGreaterThanOrEqual(a!.highCents);
      }
    },
  );

  // Two cases the random property found (common practice, no source: a bigger job never costs less):
  // frames re-divided into more, shorter ones that pack into fewer lengths, and a counted door
  // re-centred so a strip beside it is no longer needed.
  const plainWall = (length: number, treatment: string, openings: ProjectInput['rooms'][number]['walls'][number]['openings'] = []): number =>
    estimate(
      {
        rooms: [{ name: 'Test room', ceilingHeight: 96, walls: [{ length, outlets: 1, openings }], treatment: { id: treatment, height: 'full' } }],
        builtBefore1978: 'no',
        measuredBy: 'homeowner-tape',
      },
      rateBook,
    ).price.totalCents;
  it('one more step on a stair wall costs no less: whole-length stiles no longer crowd out the exact count', () => {
    // Found by the property (common practice, no source: a bigger job never costs less). The 63 stile
    // and rail cuts of 8 ft stock include 17 that no other cut fits beside; the rest were counted by
    // heuristics, one length too many with the shorter stair's 6 in top stiles. Those 17 now take a
    // length each and the other 46 are counted exactly (docs/sources.md §50).
    const withStair = (steps: number): number =>
      estimate(
        {
          rooms: [
            {
              name: 'Test room',
              ceilingHeight: 84 + 7 * 5,
              walls: [
                {
                  length: 479,
                  openings: [
                    { kind: 'door', width: 65, sillHeight: 9, offset: 137, count: 1 },
                    { kind: 'door', sillHeight: 9, offset: 249, count: 1 },
                  ],
                },
                { length: 479, stair: { steps, rise: 5, run: 10, startsAt: 'left' } },
              ],
              treatment: { id: 'flat-panel', height: 'wainscot', wainscotHeight: 38 },
            },
          ],
          builtBefore1978: 'no',
          measuredBy: 'homeowner-estimate',
          paint: false,
        },
        { ...rateBook, minimumJobCents: 0 },
      ).price.totalCents;
    expect(withStair(7)).toBeGreaterThanOrEqual(withStair(6));
  });
  it('two more steps cost no less: the skirt board is nailed like the baseboard it replaces', () => {
    // Found by the property (common practice, no source): two more steps made the skirt 22 in longer
    // and the baseboard 18 in shorter, and with the skirt's brads left out a box of 2 in brads went.
    const room = (steps: number): number =>
      estimate(
        {
          rooms: [
            {
              name: 'Test room',
              ceilingHeight: 84 + 8 * 6,
              walls: [
                {
                  length: 441,
                  openings: [
                    { kind: 'door', width: 18, sillHeight: 6 },
                    { kind: 'door', width: 18, sillHeight: 9 },
                    { kind: 'door', width: 18 },
                  ],
                },
                { length: 441 },
                { length: 441, stair: { steps, rise: 6, run: 9, startsAt: 'left' } },
              ],
              treatment: { id: 'shiplap-horizontal', height: 'wainscot' },
            },
          ],
          builtBefore1978: 'no',
          measuredBy: 'homeowner-estimate',
          paint: false,
        },
        { ...rateBook, minimumJobCents: 0 },
      ).price.totalCents;
    expect(room(8)).toBeGreaterThanOrEqual(room(6));
  });
  it('a 191 in full-height picture-frame wall costs no less than a 190 in one', () => {
    expect(plainWall(191, 'picture-frame')).toBeGreaterThanOrEqual(plainWall(190, 'picture-frame'));
  });
  it('a wainscot that rises into an opening keeps a return for its cap rail, so a taller room costs no less', () => {
    // Found by the property: at 127 in the default wainscot top (a third of the ceiling) is 42 in
    // and the cap rail passes under an opening whose sill is at 44 in; at 128 in it runs into it.
    const priceAt = (ceilingHeight: number) =>
      estimate(
        {
          rooms: [
            {
              name: 'Test room',
              ceilingHeight,
              walls: [{ length: 60, outlets: 0, openings: [{ kind: 'door', sillHeight: 44 }] }],
              treatment: { id: 'shiplap-vertical-ply', height: 'wainscot' },
            },
          ],
          builtBefore1978: 'no',
          measuredBy: 'homeowner-estimate',
        },
        { ...rateBook, minimumJobCents: 0 },
      );
    const [lower, taller] = [priceAt(127), priceAt(128)];
    expect(taller.takeoff.rooms[0]!.returns).toBe(1);
    expect(taller.price.totalCents).toBeGreaterThanOrEqual(lower.price.totalCents);
  });
  it('a 288 in shiplap wall with a counted door costs no less than a 287 in one', () => {
    const door = [{ kind: 'door' as const }];
    expect(plainWall(288, 'shiplap-vertical-ply', door)).toBeGreaterThanOrEqual(plainWall(287, 'shiplap-vertical-ply', door));
  });

  fcTest.prop([arb, fc.integer({ min: 0, max: 2_000_000 }), fc.integer({ min: 1, max: 50_000 })], { numRuns: 100 })(
    'low ≤ high, and the minimum job holds',
    (c, minimum, rounding) => {
      const rb = { ...rateBook, minimumJobCents: minimum, roundingCents: rounding };
      const p = estimate(oneWall(c.length, c.treatment, c.height, { paint: c.paint, measuredBy: c.measuredBy, photoCount: c.photos }, c.outlets), rb).price;
      expect(p.lowCents).toBeLessThanOrEqual(p.highCents);
      expect(p.lowCents).toBeGreaterThanOrEqual(minimum);
      expect(p.totalCents).toBeGreaterThanOrEqual(minimum);
      expect(p.highCents).toBeGreaterThanOrEqual(p.totalCents);
    },
  );
});
