import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CASING_REVEAL, newFaceThickness, proudOfCasing } from './build-up.ts';
import { blockedAreaSqIn, casingBlock } from './casings.ts';
import { estimate } from './estimate.ts';
import { tryPlaceOpenings } from './geometry.ts';
import { fieldsOf } from './input-refusal.testing.ts';
import { sampleRateBook } from './sample-data.ts';
import type { ProjectInput, RateBookInput } from './schemas.ts';
import { takeoff } from './takeoff.ts';
import { parseRateBook } from './validate.ts';

type OpeningInput = NonNullable<ProjectInput['rooms'][number]['walls'][number]['openings']>[number];

const book = (change: (rb: RateBookInput) => void = () => {}) => {
  const rb = sampleRateBook();
  change(rb);
  return parseRateBook(rb);
};

const accentWall = (length = 168, door: OpeningInput = { kind: 'door', width: 36, height: 80, offset: 66 }, treatment = 'board-and-batten'): ProjectInput => ({
  rooms: [
    { name: 'Living room', ceilingHeight: 96, walls: [{ label: 'Accent wall', length, openings: [door] }], treatment: { id: treatment, height: 'full' } },
  ],
  paint: false,
  builtBefore1978: 'no',
  measuredBy: 'site-measure',
  photoCount: 0,
});

describe('a 14 ft full-height board-and-batten accent wall with a 36 × 80 in door in 2-1/4 in casing', () => {
  // Hand-worked, demo rate book. Casing 2-1/4 × 11/16 in: from memory, docs/sources.md §30.
  // Band: top of the 5-1/4 in baseboard to the 96 in ceiling = 90.75 in; gross 168 × 90.75 ÷ 144 = 105.875 sq ft.
  // Door at 66 in; with its casing it blocks 66 − 2.25 = 63.75 to 66 + 36 + 2.25 = 104.25 in (40.5 in wide),
  //   up to 80 + 2.25 = 82.25 in, of which 82.25 − 5.25 = 77 in is in the band: 40.5 × 77 = 3118.5 sq in = 21.65625 sq ft
  //   (the door alone would be 36 × 74.75 ÷ 144 = 18.6875 sq ft). Net 105.875 − 21.65625 = 84.21875 sq ft.
  const rb = book();
  const e = estimate(accentWall(), rb);
  const wall = e.takeoff.rooms[0]!.walls[0]!;

  it('stops the treatment at the casing’s outside edge', () => {
    expect(wall.grossSqFt).toBeCloseTo(105.875, 9);
    expect(wall.openingsSqFt).toBeCloseTo(21.65625, 9);
    expect(wall.netSqFt).toBeCloseTo(84.21875, 9);
    // The opening itself is reported as measured, with its casing beside it.
    expect(wall.openings[0]).toMatchObject({ offset: 66, width: 36, height: 80, casingWidth: 2.25, inBand: true });
    // No backing panel runs under the casing.
    for (const p of wall.pieces.filter((x) => x.role === 'panel'))
      expect(Math.min(p.x + p.width, 104.25) - Math.max(p.x, 63.75) > 0.01 && p.y < 82.25 - 0.01).toBe(false);
  });

  it('sets the battens beside the door against the casing, none straddling it', () => {
    // Battens: 1x3 MDF, 2-1/2 in wide (DOC PS 20 dressed 1x3 = 3/4 × 2-1/2 in, docs/sources.md §1), at most 16 in on centre:
    //   n = ceil((168 − 2.5) ÷ 16) + 1 = 12, pitch 165.5 ÷ 11 = 15.045 in. The 6th (75.23 in) and 7th (90.27 in)
    //   land on the door and casing; each moves to the nearer casing edge: 63.75 − 2.5 = 61.25 in and 104.25 in.
    const xs = wall.pieces.filter((p) => p.role === 'batten').map((p) => p.x);
    expect(xs.some((x) => Math.abs(x - 61.25) < 1e-9)).toBe(true);
    expect(xs.some((x) => Math.abs(x - 104.25) < 1e-9)).toBe(true);
    for (const p of wall.pieces.filter((x) => x.role === 'batten')) {
      const across = Math.min(p.x + p.width, 104.25) - Math.max(p.x, 63.75);
      // A batten over the door's width only above the head casing (none here: the head casing tops out at 82.25 in).
      if (across > 0.01) expect(p.y).toBeGreaterThanOrEqual(82.25 - 1e-9);
    }
  });

  it('adds a back band around the casing, because 1 in of new work stands proud of an 11/16 in casing', () => {
    // 1/4 in MDF backing + 3/4 in batten (PS 20) = 1 in; the face may come to 11/16 − 1/8 = 9/16 in (common practice,
    //   no source, docs/sources.md §31); 1 − 9/16 = 7/16 in proud → back band.
    const t = rb.catalogue.treatments.find((x) => x.id === 'board-and-batten')!;
    expect(newFaceThickness(t, rb.catalogue)).toBeCloseTo(1, 9);
    expect(CASING_REVEAL).toBe(0.125);
    expect(proudOfCasing(1, 0.6875)).toBeCloseTo(0.4375, 9);
    // Runs: two sides of 80 + 2.25 = 82.25 in and a head of 36 + 2 × 2.25 = 40.5 in → 205 in = 17.083 ft.
    expect(e.takeoff.rooms[0]!.backBandFeet).toBeCloseTo(205 / 12, 9);
    // Cuts with 1 in at each end for the miters: 84.25, 84.25, 42.5 in; no two fit one 96 in length → 3 lengths,
    //   an exact cutting layout (docs/sources.md §47), so no waste factor on top: 3 lengths.
    const line = e.takeoff.materials.find((m) => m.id === 'moulding:back-band')!;
    expect(line.cuts).toBe(3);
    expect(line.quantity).toBe(3);
    // Labour: 17.083 ft × 0.05 h per ft (demo rate) = 0.854 h.
    const labour = e.price.labour.find((l) => l.task === 'back-band')!;
    expect(labour.hours).toBeCloseTo(0.85, 2); // hours shown to the hundredth
    expect(e.takeoff.notes.some((n) => n.includes('Accent wall') && n.includes('back band') && n.includes('17.1 ft'))).toBe(true);
  });

  it('says the casing needs a back band or furring when the rate book offers none', () => {
    const bare = estimate(
      accentWall(),
      book((r) => void delete r.catalogue.backBandId),
    );
    expect(bare.takeoff.rooms[0]!.backBandFeet).toBeUndefined();
    expect(bare.price.labour.some((l) => l.task === 'back-band')).toBe(false);
    expect(bare.takeoff.notes.some((n) => n.includes('need a back band or furring'))).toBe(true);
  });

  it('adds no back band where the new face stays behind the casing (1/4 in beadboard)', () => {
    // 1/4 in beadboard panel ≤ 9/16 in: no back band.
    const bead = estimate(accentWall(168, { kind: 'door', width: 36, height: 80, offset: 66 }, 'beadboard'), rb);
    expect(bead.takeoff.rooms[0]!.backBandFeet).toBeUndefined();
    expect(bead.takeoff.notes.some((n) => n.includes('back band'))).toBe(false);
  });

  it('takes a casing width of 0 as no casing: the door alone comes off', () => {
    const none = takeoff(accentWall(168, { kind: 'door', width: 36, height: 80, offset: 66, casingWidth: 0 }), rb.catalogue);
    // 36 × 74.75 ÷ 144 = 18.6875 sq ft.
    expect(none.rooms[0]!.walls[0]!.openingsSqFt).toBeCloseTo(18.6875, 9);
    expect(none.rooms[0]!.backBandFeet).toBeUndefined();
  });
});

describe('a 12 ft flat-panel wainscot wall with a 36 × 80 in door at 54 in, in 2-1/4 in casing', () => {
  // Casing 2-1/4 in (from memory, docs/sources.md §30): the door blocks 54 − 2.25 = 51.75 to 54 + 36 + 2.25 = 92.25 in.
  const project: ProjectInput = {
    rooms: [
      {
        name: 'Dining room',
        ceilingHeight: 96,
        walls: [{ length: 144, openings: [{ kind: 'door', width: 36, height: 80, sillHeight: 0, offset: 54 }] }],
        treatment: { id: 'flat-panel', height: 'wainscot', wainscotHeight: 36 },
      },
    ],
    paint: false,
    builtBefore1978: 'no',
    measuredBy: 'site-measure',
    photoCount: 0,
  };
  const t = takeoff(project, book().catalogue);
  const pieces = t.rooms[0]!.walls[0]!.pieces;

  it('stops rails, cap rail and baseboard at the casing and sets a stile against it', () => {
    // Rails, cap rail and baseboard: 0–51.75 and 92.25–144 in (common practice, no source: they butt the casing).
    for (const role of ['rail', 'cap-rail', 'baseboard'] as const) {
      const runs = pieces.filter((p) => p.role === role).map((p) => [p.x, p.x + p.width]);
      expect(runs.length).toBeGreaterThan(0);
      for (const [a, b] of runs) expect(b! <= 51.75 + 1e-9 || a! >= 92.25 - 1e-9).toBe(true);
    }
    // Stiles: 1x4, 3-1/2 in (DOC PS 20, docs/sources.md §1), at most 24 in on centre: n = ceil((144 − 3.5) ÷ 24) + 1 = 7,
    //   pitch 140.5 ÷ 6 = 23.417 in; the 4th (70.25 in) lands on the door, 22 in from either side, and goes to the
    //   left one: 51.75 − 3.5 = 48.25 in, its edge on the casing's.
    const stiles = pieces.filter((p) => p.role === 'stile').map((p) => p.x);
    expect(stiles.some((x) => Math.abs(x - 48.25) < 1e-9)).toBe(true);
    expect(stiles.every((x) => x + 3.5 <= 51.75 + 1e-9 || x >= 92.25 - 1e-9)).toBe(true);
  });

  it('adds the back band: 1/4 in backing + 3/4 in stile = 1 in, more than 11/16 − 1/8 = 9/16 in', () => {
    // Two sides of 82.25 in and a 40.5 in head = 205 in (docs/sources.md §31).
    expect(t.rooms[0]!.backBandFeet).toBeCloseTo(205 / 12, 9);
  });
});

describe('placing counted openings with their casings', () => {
  it('keeps casings off each other and off the wall ends', () => {
    // Two counted 24 in windows with 2-1/4 in casings: the first 3 in from the end (≥ 2.25), the next
    //   2.25 + 2.25 = 4.5 in after it (more than the 3 in spacing): 3 + 24 + 4.5 = 31.5 in (common practice, no source).
    const placed = tryPlaceOpenings([{ kind: 'window', count: 2, width: 24 }], 120, 2.25);
    expect(placed.ok && placed.openings.map((o) => o.offset)).toEqual([3, 31.5]);
    // Without casings the old 3 in spacing stands: 3 and 30.
    const bare = tryPlaceOpenings([{ kind: 'window', count: 2, width: 24 }], 120, 0);
    expect(bare.ok && bare.openings.map((o) => o.offset)).toEqual([3, 30]);
  });

  it('refuses a counted door whose casings do not fit the wall, naming the wall in the project’s units', () => {
    // A 36 in door in 4 in casings needs 4 + 36 + 4 = 44 in; the wall is 42 in.
    const project = accentWall(42, { kind: 'door', width: 36, height: 80, casingWidth: 4 });
    const fields = fieldsOf(() => takeoff(project, book().catalogue));
    expect(fields['rooms.0.walls.0.openings']).toMatch(/this 3' 6" wall.*room for its casing/);
  });

  it('takes an overlap of two casings off the wall once', () => {
    // Two 36 in doors at 2.25 and 40.25 in with 2-1/4 in casings: blocks 0–40.5 and 38–78.5 in overlap by 2.5 in,
    //   each 77.75 + 2.25 = 80 in tall. Union 78.5 × 80 = 6280 sq in, not 2 × 40.5 × 80 = 6480 (geometry).
    const o = { kind: 'door' as const, height: 77.75, sillHeight: 0, inBand: true, assumed: false, casingWidth: 2.25, width: 36 };
    const blocks = [casingBlock({ ...o, offset: 2.25 }, 200), casingBlock({ ...o, offset: 40.25 }, 200)];
    expect(blockedAreaSqIn(blocks, 200, 0, 80)).toBeCloseTo(6280, 9);
  });
});

describe('property: with casings, more wall never costs less', () => {
  // common practice, no source: a longer or taller wall needs at least as much work and material.
  it('holds for every treatment with a cased door, measured or counted', () => {
    const rb = book();
    const ids = rb.catalogue.treatments.filter((t) => t.enabled).map((t) => t.id);
    fc.assert(
      fc.property(
        fc.integer({ min: 60, max: 360 }),
        fc.integer({ min: 1, max: 24 }),
        fc.constantFrom(...ids),
        fc.option(fc.integer({ min: 0, max: 20 }), { nil: undefined }),
        fc.constantFrom(0, 2.25, 3.5),
        (length, more, id, offset, casingWidth) => {
          const door: OpeningInput = { kind: 'door', width: 30, height: 80, casingWidth, ...(offset === undefined ? {} : { offset }) };
          const a = estimate(accentWall(length, door, id), rb).price.subtotalCents;
          const b = estimate(accentWall(length + more, door, id), rb).price.subtotalCents;
          return b >= a;
        },
      ),
      { numRuns: 100, seed: 20261202 },
    );
  });
});
