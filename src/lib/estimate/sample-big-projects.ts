/**
 * DEMO DATA — INVENTED. Big projects for tests and benchmarks of the size limits, all for the sample
 * rate book's treatments.
 */
import type { ProjectInput } from './schemas.ts';

type RoomInput = ProjectInput['rooms'][number];

/**
 * The most the schema allows, in the costliest treatment: 20 rooms × 16 walls × 16 openings, 100 ft
 * walls under 20 ft ceilings, covered to the ceiling in horizontal shiplap.
 */
export function schemaMaximumProject(): ProjectInput {
  return {
    rooms: Array.from({ length: 20 }, (_, r) => ({
      name: `Room ${r + 1}`,
      ceilingHeight: 240,
      walls: Array.from({ length: 16 }, () => ({
        length: 1200,
        openings: Array.from({ length: 16 }, (_, k) => ({ kind: k % 2 ? ('window' as const) : ('door' as const) })),
      })),
      treatment: { id: 'shiplap-horizontal', height: 'full' as const },
    })),
    builtBefore1978: 'no',
    measuredBy: 'homeowner-tape',
  };
}

/** An ordinary large house: 8 rooms of 6 walls, 9 ft ceilings, every treatment, doors, windows and outlets. */
export function largeHouse(): ProjectInput {
  const treatments = ['shiplap-horizontal', 'shiplap-vertical-ply', 'board-and-batten', 'beadboard', 'flat-panel', 'picture-frame'];
  const room = (r: number): RoomInput => ({
    name: `Room ${r + 1}`,
    ceilingHeight: 108,
    length: 216,
    width: 168,
    walls: [
      { side: 'length', openings: [{ kind: 'window', count: 2 }], outlets: 2 },
      { side: 'width', openings: [{ kind: 'door' }], outlets: 1, switches: 1 },
      { side: 'length', outlets: 2 },
      { side: 'width', openings: [{ kind: 'window' }], outlets: 1 },
      { length: 96, outlets: 1 },
      { length: 60 },
    ],
    treatment: { id: treatments[r % treatments.length]!, height: r % 2 ? 'wainscot' : 'full' },
    replaceBaseboard: r % 3 === 0,
  });
  return {
    rooms: Array.from({ length: 8 }, (_, r) => room(r)),
    paint: true,
    builtBefore1978: 'not-sure',
    measuredBy: 'homeowner-tape',
    photoCount: 2,
  };
}

/**
 * Close to the size limits and still accepted: 20 rooms of 6 walls, 28 ft long under 9 ft ceilings, in
 * full-height horizontal shiplap with a door and two windows on every wall.
 */
export function biggestAcceptedProject(): ProjectInput {
  return {
    rooms: Array.from({ length: 20 }, (_, r) => ({
      name: `Room ${r + 1}`,
      ceilingHeight: 108,
      walls: Array.from({ length: 6 }, (_, w) => ({
        length: 330 + r + w,
        openings: [{ kind: 'door' as const }, { kind: 'window' as const, count: 2 }],
        outlets: 3,
        switches: 1,
      })),
      treatment: { id: 'shiplap-horizontal', height: 'full' as const },
    })),
    builtBefore1978: 'no',
    measuredBy: 'homeowner-tape',
  };
}

/**
 * Inside the size limits and as costly as they allow per piece: 20 rooms of 6 walls, every wall and
 * opening a different size (so the cut lists hold thousands of different lengths), in full-height
 * board and batten over backing sheets.
 */
export function costliestAcceptedProject(): ProjectInput {
  return {
    rooms: Array.from({ length: 20 }, (_, r) => ({
      name: `Room ${r + 1}`,
      ceilingHeight: 100 + (r % 7),
      walls: Array.from({ length: 6 }, (_, w) => {
        const length = 300 + (((r * 6 + w) * 37) % 97) + 0.3 * w;
        return {
          length,
          openings: [0, 1, 2].map((k) => ({
            kind: 'window' as const,
            width: 20 + (((r + w + k) * 13) % 30),
            height: 30 + (((r * w + k) * 7) % 40),
            sillHeight: 5 + (((r + k) * 3) % 20),
            offset: (k * length) / 3 + ((r + w) % 10),
          })),
        };
      }),
      treatment: { id: 'board-and-batten', height: 'full' as const },
    })),
    builtBefore1978: 'no',
    measuredBy: 'homeowner-tape',
  };
}
