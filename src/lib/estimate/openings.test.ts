/** Doors and windows on a wall: where counted ones go, and walls they cannot fit on. */
import { fc, test as fcTest } from '@fast-check/vitest';
import { describe, expect, it } from 'vitest';
import { estimate, EstimateInputError, formatLength, sampleRateBook, type ProjectInput } from './index.ts';
import { fieldsOf } from './input-refusal.testing.ts';

type Openings = ProjectInput['rooms'][number]['walls'][number]['openings'];

function project(walls: Array<{ length: number; openings: Openings }>): ProjectInput {
  return {
    rooms: [{ name: 'Test room', ceilingHeight: 96, walls, treatment: { id: 'beadboard', height: 'wainscot' } }],
    builtBefore1978: 'no',
    measuredBy: 'homeowner-tape',
  };
}

describe('counted doors and windows', () => {
  // A wall can hold two openings only where they do not overlap (plain geometry, no source needed).
  // A 36 in door on the 42 in end wall of a hallway: 3 in each side (common practice, no source).
  it('fits a counted door on a narrow hallway end wall', () => {
    const e = estimate(project([{ length: 42, openings: [{ kind: 'door' }] }]), sampleRateBook());
    expect(e.takeoff.rooms[0]!.walls[0]!.openings[0]!.offset).toBe(3);
  });

  // Spread evenly, these two windows once landed at 60–84 and 82–106 in.
  it('places two counted windows beside a measured door without overlap', () => {
    const e = estimate(
      project([
        {
          length: 120,
          openings: [
            { kind: 'door', width: 30, offset: 30 },
            { kind: 'window', width: 24, count: 2 },
          ],
        },
      ]),
      sampleRateBook(),
    );
    const placed = e.takeoff.rooms[0]!.walls[0]!.openings;
    expect(placed).toHaveLength(3);
    for (let i = 1; i < placed.length; i++) expect(placed[i]!.offset).toBeGreaterThanOrEqual(placed[i - 1]!.offset + placed[i - 1]!.width);
    expect(placed.find((o) => o.kind === 'door')!.offset).toBe(30);
  });

  it('refuses counted openings that add up to less than the wall but fit in none of its free stretches', () => {
    // 120 in wall, a 36 in door at 42–78: 42 in free on each side; a 48 in window fits neither,
    // though 36 + 48 = 84 in is less than the wall.
    const p = project([
      { length: 96, openings: [] },
      {
        length: 120,
        openings: [
          { kind: 'door', offset: 42 },
          { kind: 'window', width: 48 },
        ],
      },
    ]);
    const f = fieldsOf(() => estimate(p, sampleRateBook()));
    expect(Object.keys(f)).toEqual(['rooms.0.walls.1.openings']);
    expect(f['rooms.0.walls.1.openings']).toMatch(/a window 4' wide/);
    expect(f['rooms.0.walls.1.openings']).toMatch(/3' 6", 3' 6"/);
    const metric = { ...sampleRateBook(), units: 'metric' as const };
    // Source: 48 in × 25.4 mm/in = 1219 mm (NIST SP 811, the inch is 25.4 mm exactly).
    expect(fieldsOf(() => estimate(p, metric))['rooms.0.walls.1.openings']).toMatch(/a window 1219 mm wide/);
  });

  const opening = fc.record(
    {
      kind: fc.constantFrom('door' as const, 'window' as const),
      count: fc.integer({ min: 1, max: 3 }),
      width: fc.integer({ min: 12, max: 60 }),
      offset: fc.integer({ min: 0, max: 200 }),
    },
    { requiredKeys: ['kind'] },
  );
  // Property (plain geometry): an accepted wall has every opening on it, none overlapping another,
  // and the net area takes each opening off once.
  fcTest.prop([fc.integer({ min: 60, max: 300 }), fc.array(opening, { maxLength: 4 })], { numRuns: 150 })(
    'accepted openings never overlap and are taken off once',
    (length, list) => {
      const openings = list.map((o) => (o.offset !== undefined ? { ...o, count: 1 } : o));
      let e;
      try {
        e = estimate(project([{ length, openings }]), sampleRateBook());
      } catch (err) {
        if (err instanceof EstimateInputError) return;
        throw err;
      }
      const wall = e.takeoff.rooms[0]!.walls[0]!;
      expect(wall.openings).toHaveLength(openings.reduce((s, o) => s + (o.count ?? 1), 0));
      for (const o of wall.openings) {
        expect(o.offset).toBeGreaterThanOrEqual(0);
        expect(o.offset + o.width).toBeLessThanOrEqual(length + 1e-9);
      }
      for (let i = 1; i < wall.openings.length; i++) {
        expect(wall.openings[i]!.offset).toBeGreaterThanOrEqual(wall.openings[i - 1]!.offset + wall.openings[i - 1]!.width - 1e-9);
      }
      expect(wall.netSqFt).toBeGreaterThanOrEqual(-1e-9);
    },
  );

  // The note a homeowner reads must describe the opening the takeoff drew (one source of defaults).
  it('describes counted openings at the sizes and sill it placed them at', () => {
    const e = estimate(project([{ length: 240, openings: [{ kind: 'door' }, { kind: 'window' }] }]), sampleRateBook());
    const [door, window] = ['door', 'window'].map((k) => e.takeoff.rooms[0]!.walls[0]!.openings.find((o) => o.kind === k)!);
    const note = e.takeoff.notes.find((n) => n.startsWith('Doors and windows without measurements'))!;
    const len = (x: number): string => formatLength(x, 'imperial');
    expect(note).toContain(`doors ${len(door!.width)} × ${len(door!.height)}`);
    expect(note).toContain(`windows ${len(window!.width)} × ${len(window!.height)} with the sill at ${len(window!.sillHeight)}`);
  });
});
