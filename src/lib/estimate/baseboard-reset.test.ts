import { describe, expect, it } from 'vitest';
import { estimate, parseRateBook, sampleRateBook, type ProjectInput } from './index.ts';

const rb = parseRateBook(sampleRateBook());
const wall = (treatment: string, replaceBaseboard = false): ProjectInput => ({
  rooms: [
    {
      name: 'Den',
      ceilingHeight: 96,
      walls: [{ length: 144 }],
      treatment: { id: treatment, height: 'wainscot', wainscotHeight: 40 },
      replaceBaseboard,
    },
  ],
  builtBefore1978: 'no',
  measuredBy: 'site-measure',
});

describe('the existing baseboard when the new work stands proud of it', () => {
  // Source: docs/sources.md §31 (common practice, no source): the new face stays 1/8 in behind the trim
  // it meets. The existing baseboard is taken as 1/2 in thick (from memory): the limit is 3/8 in.
  it('resets the baseboard under board and batten: 1/4 in backing + 3/4 in batten stand 5/8 in proud', () => {
    const e = estimate(wall('board-and-batten'), rb);
    const room = e.takeoff.rooms[0]!;
    expect(room.baseboardReset).toBe(true);
    // Removed and installed again over 12 ft, at the demo rates (0.02 and 0.05 h per ft, invented):
    // 0.24 h + 0.6 h; no new baseboard bought.
    expect(room.baseboardRemovedFeet).toBeCloseTo(12, 9);
    expect(e.price.labour.find((l) => l.task === 'baseboard-removal')!.hours).toBeCloseTo(0.24, 9);
    expect(e.price.labour.find((l) => l.task === 'baseboard')!.hours).toBeCloseTo(0.6, 9);
    expect(e.takeoff.materials.some((m) => m.id === 'moulding:base-5')).toBe(false);
    expect(e.takeoff.notes.join(' ')).toMatch(/In Den, the new work would stand proud of the existing baseboard/);
  });

  it('leaves it alone under 1/4 in beadboard, and does not count it twice when it is replaced', () => {
    expect(estimate(wall('beadboard'), rb).takeoff.rooms[0]!.baseboardReset).toBeUndefined();
    const replaced = estimate(wall('board-and-batten', true), rb).takeoff.rooms[0]!;
    expect(replaced.baseboardReset).toBeUndefined();
    expect(replaced.baseboardRemovedFeet).toBeCloseTo(12, 9);
  });

  it('an owner whose walls have thick baseboard sets it, and nothing is reset', () => {
    const thick = sampleRateBook();
    thick.catalogue.existingBaseboardThickness = 1.25;
    expect(estimate(wall('board-and-batten'), parseRateBook(thick)).takeoff.rooms[0]!.baseboardReset).toBeUndefined();
  });
});
