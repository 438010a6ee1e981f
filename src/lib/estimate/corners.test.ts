/** Default corner counts from the walls covered, and corner trim cut from stock lengths. */
import { fc, test as fcTest } from '@fast-check/vitest';
import { describe, expect, it } from 'vitest';
import { defaultInsideCorners } from './corners.ts';
import { estimate, sampleRateBook, type ProjectInput } from './index.ts';
import { fieldsOf } from './input-refusal.testing.ts';

type Side = 'length' | 'width';
const sides = (...s: Side[]): Array<{ side: Side }> => s.map((side) => ({ side }));

describe('default inside corners', () => {
  // Plain geometry of a rectangular room: walls on different sides meet at a corner, walls on the same side face each other.
  it('counts the corners between walls on different sides', () => {
    expect(defaultInsideCorners(sides('length', 'width', 'length', 'width'))).toBe(4); // closed room
    expect(defaultInsideCorners(sides('length', 'width', 'length'))).toBe(2); // three walls in a U
    expect(defaultInsideCorners(sides('length', 'width'))).toBe(1);
    expect(defaultInsideCorners(sides('length', 'length'))).toBe(0); // a hallway's two long walls
    expect(defaultInsideCorners(sides('width', 'length', 'length', 'width'))).toBe(2); // not closed: two walls side by side
  });

  // Walls given by their length keep the older rule (common practice, no source): 4+ close a room, fewer are in a line.
  it('keeps the older rule for walls given by length', () => {
    expect(defaultInsideCorners([{ length: 120 }, { length: 120 }])).toBe(1);
    expect(defaultInsideCorners([{ length: 120 }, { length: 96 }, { length: 120 }, { length: 96 }])).toBe(4);
  });
});

// A 3 × 20 ft hallway (36 × 240 in) in beadboard wainscot, the two long walls only.
function hallway(extra: Partial<ProjectInput['rooms'][number]> = {}): ProjectInput {
  return {
    rooms: [
      {
        name: 'Hallway',
        ceilingHeight: 96,
        length: 240,
        width: 36,
        walls: sides('length', 'length'),
        treatment: { id: 'beadboard', height: 'wainscot', wainscotHeight: 36 },
        ...extra,
      },
    ],
    builtBefore1978: 'no',
    measuredBy: 'site-measure',
  };
}

describe('a hallway with two long walls', () => {
  // The two walls are parallel: no inside corner, so no corner labour (the older rule counted 1).
  it('has no inside corner and no corner labour', () => {
    const e = estimate(hallway(), sampleRateBook());
    expect(e.takeoff.rooms[0]!.insideCorners).toBe(0);
    expect(e.price.labour.some((l) => l.task === 'corners')).toBe(false);
  });

  it('still takes an explicit count', () => {
    const e = estimate(hallway({ insideCorners: 2, outsideCorners: 1 }), sampleRateBook());
    expect(e.takeoff.rooms[0]!.insideCorners).toBe(2);
    expect(e.takeoff.rooms[0]!.outsideCorners).toBe(1);
  });
});

// The demo rate book names an inside and an outside corner moulding (invented demo stock).
const withCornerTrim = () => sampleRateBook();
function withoutCornerTrim() {
  const rb = sampleRateBook();
  delete rb.catalogue.insideCornerTrimId;
  delete rb.catalogue.outsideCornerTrimId;
  return rb;
}

describe('corner trim', () => {
  // A 5 × 8 ft bathroom, four walls by side, wainscot to 39-1/2 in over a 5-1/4 in baseboard: band 34.25 in.
  // Four inside corners; each piece 34.25 + 2 × 1 in end allowance = 36.25 in. Two fit a 96 in length
  // (2 × 36.25 + 0.125 kerf = 72.625 in; three would need 108.875 in), so 4 pieces = 2 lengths.
  // Source: plain arithmetic on the demo stock; docs/sources.md §9 for kerf.
  it('cuts one piece per corner the band high from stock lengths', () => {
    const p: ProjectInput = {
      rooms: [
        {
          name: 'Bathroom',
          ceilingHeight: 96,
          length: 96,
          width: 60,
          walls: sides('width', 'length', 'width', 'length'),
          treatment: { id: 'shiplap-vertical-ply', height: 'wainscot', wainscotHeight: 39.5 },
        },
      ],
      builtBefore1978: 'no',
      measuredBy: 'site-measure',
    };
    const e = estimate(p, withCornerTrim());
    const line = e.takeoff.materials.find((l) => l.id === 'moulding:corner-in')!;
    expect(line.cuts).toBe(4);
    expect(line.needed).toBe(2);
    expect(e.takeoff.materials.some((l) => l.id === 'moulding:corner-out')).toBe(false);
    expect(estimate(p, withoutCornerTrim()).takeoff.materials.some((l) => l.id === 'moulding:corner-in')).toBe(false);
  });

  it('refuses a corner trim id that is not in the catalogue', () => {
    const rb = sampleRateBook();
    rb.catalogue.insideCornerTrimId = 'nope';
    expect(fieldsOf(() => estimate(hallway(), rb))['rateBook.catalogue.insideCornerTrimId']).toMatch(/No moulding with id "nope"/);
  });

  // More corners or a taller band never cost less with corner trim on.
  fcTest.prop(
    [
      fc.record({
        inside: fc.integer({ min: 0, max: 8 }),
        more: fc.integer({ min: 0, max: 3 }),
        outside: fc.integer({ min: 0, max: 3 }),
        top: fc.integer({ min: 24, max: 60 }),
        taller: fc.integer({ min: 0, max: 12 }),
      }),
    ],
    { numRuns: 100, seed: 20261202 },
  )('more corners or a taller band never cost less', (c) => {
    const rb = withCornerTrim();
    const price = (inside: number, top: number): number =>
      estimate(hallway({ insideCorners: inside, outsideCorners: c.outside, treatment: { id: 'beadboard', height: 'wainscot', wainscotHeight: top } }), rb).price
        .totalCents;
    expect(price(c.inside + c.more, c.top + c.taller)).toBeGreaterThanOrEqual(price(c.inside, c.top));
  });
});
