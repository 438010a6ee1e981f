/** Fixtures on a wall: what they take off the covered area, their labour and cautions, and walls they do not fit. */
import { fc, test as fcTest } from '@fast-check/vitest';
import { describe, expect, it } from 'vitest';
import { estimate, formatLength, sampleRateBook, type ProjectInput } from './index.ts';
import { fieldsOf } from './input-refusal.testing.ts';

type WallInput = ProjectInput['rooms'][number]['walls'][number];

// A 5 × 8 ft bathroom (60 × 96 in), 96 in ceiling, vertical plywood-strip shiplap wainscot to 39-1/2 in
// (docs/sources.md §8), one door, one window, a 60 in tub across one end wall, a vanity and a toilet.
function bathroom(withFixtures: boolean): ProjectInput {
  const walls: WallInput[] = [
    { label: 'Tub wall', side: 'width', ...(withFixtures ? { fixtures: [{ kind: 'tub' }] } : {}) },
    { label: 'Vanity wall', side: 'length', ...(withFixtures ? { fixtures: [{ kind: 'vanity' }, { kind: 'toilet' }] } : {}) },
    { label: 'Door wall', side: 'width', openings: [{ kind: 'door', width: 30, height: 80, sillHeight: 0, offset: 15 }] },
    { label: 'Window wall', side: 'length', openings: [{ kind: 'window', width: 24, height: 36, sillHeight: 42, offset: 36 }] },
  ];
  return {
    rooms: [
      {
        name: 'Bathroom',
        ceilingHeight: 96,
        length: 96,
        width: 60,
        walls,
        treatment: { id: 'shiplap-vertical-ply', height: 'wainscot', wainscotHeight: 39.5 },
        damp: true,
      },
    ],
    builtBefore1978: 'no',
    measuredBy: 'site-measure',
  };
}

describe('fixtures in a 5 × 8 ft bathroom', () => {
  const rb = sampleRateBook();
  const without = estimate(bathroom(false), rb);
  const withF = estimate(bathroom(true), rb);

  // Hand-worked (plain geometry, no source needed): band 5-1/4 in (demo baseboard) to 39-1/2 in = 34.25 in.
  // Gross: perimeter 2 × (60 + 96) = 312 in × 34.25 = 10 686 sq in.
  // Door 30 in wide in 2-1/4 in casing (demo rate book, docs/sources.md §30), sill 0, covers the whole
  // band: (30 + 2 × 2.25) × 34.25 = 1181.625 sq in. The window's sill (42 in) is above the band and the
  // cap rail (39.5 + 1.5 = 41 in), and its casing runs up its sides and over its head: nothing off.
  // Without fixtures: 10 686 − 1181.625 = 9504.375 sq in = 66.0026 sq ft.
  it('covers the walls less the door without fixtures', () => {
    expect(without.takeoff.rooms[0]!.netSqFt).toBeCloseTo(9504.375 / 144, 6);
  });

  // With fixtures (sizes from memory, fixtures.ts): the tub (60 in, stops, whole band) takes
  // 60 × 34.25 = 2055 sq in; the vanity (30 in wide, 34 in tall, stops to its height) takes
  // 30 × (34 − 5.25) = 862.5 sq in; the toilet comes off and the shiplap goes behind it: 0.
  // 9504.375 − 2055 − 862.5 = 6586.875 sq in = 45.7422 sq ft (the tub alone is about a fifth of the room).
  it('takes the tub and vanity off the covered area, not the toilet', () => {
    const room = withF.takeoff.rooms[0]!;
    expect(room.netSqFt).toBeCloseTo(6586.875 / 144, 6);
    expect(room.walls[0]!.fixturesSqFt).toBeCloseTo(2055 / 144, 6);
    expect(room.walls[1]!.fixturesSqFt).toBeCloseTo(862.5 / 144, 6);
  });

  // The vanity sits tight in the corner at 0; the toilet 3 in past it (33–53 in): common practice, no source.
  it('places the vanity in the corner and the toilet beside it', () => {
    const f = withF.takeoff.rooms[0]!.walls[1]!.fixtures!;
    expect(f.map((x) => [x.kind, x.offset, x.width, x.placement])).toEqual([
      ['vanity', 0, 30, 'stops'],
      ['toilet', 33, 20, 'behind'],
    ]);
  });

  // No strip is laid over the tub: every panel piece on the tub wall would overlap [0, 60] × band.
  it('lays no material over the tub', () => {
    const pieces = withF.takeoff.rooms[0]!.walls[0]!.pieces.filter((p) => p.role !== 'cap-rail' && p.role !== 'baseboard');
    expect(pieces).toHaveLength(0);
  });

  // Demo rate book: toilet 1.5 h to remove and reset; tub 0.5 h + vanity 1 h to scribe to (invented demo numbers).
  it('prices remove-and-reset and scribing from the rate book', () => {
    const reset = withF.price.labour.find((l) => l.task === 'fixture-reset')!;
    const scribe = withF.price.labour.find((l) => l.task === 'fixture-scribe')!;
    expect(reset.hours).toBeCloseTo(1.5, 9);
    expect(reset.basis).toBe('1 toilet × 1.5 h each');
    expect(scribe.hours).toBeCloseTo(1.5, 9);
    expect(without.price.labour.some((l) => l.task === 'fixture-reset' || l.task === 'fixture-scribe')).toBe(false);
  });

  it('cautions that a licensed plumber reconnects the fixtures', () => {
    const c = withF.takeoff.cautions.find((x) => x.id === 'fixture-trades');
    expect(c?.text).toMatch(/licensed plumber/);
    expect(c?.text).not.toMatch(/electrician/);
    expect(without.takeoff.cautions.some((x) => x.id === 'fixture-trades')).toBe(false);
  });

  it('cautions that a licensed electrician handles lights in a built-in', () => {
    const p = bathroom(false);
    p.rooms[0]!.walls[0]!.fixtures = [{ kind: 'built-in', width: 24 }];
    const c = estimate(p, rb).takeoff.cautions.find((x) => x.id === 'fixture-trades');
    expect(c?.text).toMatch(/licensed electrician/);
  });
});

describe('fixtures that do not fit', () => {
  const rb = sampleRateBook();
  const oneWall = (length: number, wall: Partial<WallInput>): ProjectInput => ({
    rooms: [{ name: 'Bath', ceilingHeight: 96, walls: [{ length, ...wall }], treatment: { id: 'beadboard', height: 'wainscot' } }],
    builtBefore1978: 'no',
    measuredBy: 'homeowner-tape',
  });

  it('refuses a tub longer than the wall, naming it in the project units', () => {
    const f = fieldsOf(() => estimate(oneWall(48, { fixtures: [{ kind: 'tub' }] }), rb));
    expect(f['rooms.0.walls.0.fixtures.0.width']).toContain(formatLength(48, 'imperial'));
  });

  // 60 in wall: vanity 0–30, the second needs 33–63: no room.
  it('refuses two counted vanities on a 60 in wall', () => {
    const f = fieldsOf(() => estimate(oneWall(60, { fixtures: [{ kind: 'vanity' }, { kind: 'vanity' }] }), rb));
    expect(f['rooms.0.walls.0.fixtures']).toMatch(/do not fit/);
  });

  it('refuses a measured fixture over a door', () => {
    const f = fieldsOf(() => estimate(oneWall(120, { openings: [{ kind: 'door', offset: 10 }], fixtures: [{ kind: 'toilet', offset: 20 }] }), rb));
    expect(f['rooms.0.walls.0.fixtures.0.offset']).toMatch(/overlaps a door/);
  });

  it('places a counted fixture beside a door, never over it', () => {
    const e = estimate(oneWall(120, { openings: [{ kind: 'door', offset: 0 }], fixtures: [{ kind: 'vanity' }] }), rb);
    expect(e.takeoff.rooms[0]!.walls[0]!.fixtures![0]!.offset).toBe(39); // door 0–36, 3 in clear
  });
});

describe('fixtures keep the price monotone', () => {
  const kinds = ['tub', 'shower', 'vanity', 'toilet', 'radiator', 'built-in'] as const;
  const treatments = ['shiplap-vertical-ply', 'shiplap-horizontal', 'board-and-batten', 'beadboard', 'flat-panel', 'picture-frame'] as const;
  const arb = fc.record({
    length: fc.integer({ min: 70, max: 400 }),
    more: fc.oneof(fc.integer({ min: 1, max: 2 }), fc.integer({ min: 1, max: 120 })),
    kind: fc.constantFrom(...kinds),
    treatment: fc.constantFrom(...treatments),
    height: fc.constantFrom('wainscot' as const, 'full' as const),
  });
  const price = (c: { kind: (typeof kinds)[number]; treatment: string; height: 'wainscot' | 'full' }, length: number): number =>
    estimate(
      {
        rooms: [
          { name: 'R', ceilingHeight: 96, walls: [{ length, fixtures: [{ kind: c.kind, width: 30 }] }], treatment: { id: c.treatment, height: c.height } },
        ],
        builtBefore1978: 'no',
        measuredBy: 'site-measure',
      },
      sampleRateBook(),
    ).price.totalCents;
  fcTest.prop([arb], { numRuns: 100, seed: 20261202 })('a longer wall with the same fixture never costs less', (c) => {
    expect(price(c, c.length + c.more)).toBeGreaterThanOrEqual(price(c, c.length));
  });
});
