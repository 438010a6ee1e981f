import { describe, expect, it } from 'vitest';
import { estimate, parseRateBook, sampleRateBook, type ProjectInput } from './index.ts';

const rb = parseRateBook(sampleRateBook());
// A 12 ft dining-room wall with one measured 36 × 48 in window, its sill (the stool) at 30 in.
const wall = (treatment: string, wainscotHeight = 40, sillHeight = 30, count?: number): ProjectInput => ({
  rooms: [
    {
      name: 'Dining room',
      ceilingHeight: 96,
      walls: [
        {
          label: 'Window wall',
          length: 144,
          openings: [{ kind: 'window', width: 36, height: 48, sillHeight, ...(count === undefined ? { offset: 40 } : { count }) }],
        },
      ],
      treatment: { id: treatment, height: 'wainscot', wainscotHeight },
    },
  ],
  builtBefore1978: 'no',
  measuredBy: 'site-measure',
});

describe('the window stool when the new work would stand proud of it', () => {
  // Worked by hand (docs/sources.md §51 and §31). Board and batten in the demo rate book: 1/4 in MDF
  // backing + a 1x3 batten, 3/4 in dressed (docs/sources.md §1) = 1 in of new face; the apron is reset
  // on it, as thick as the 11/16 in casing: 1-11/16 in out from the old wall. The stool stands 1-1/2 in
  // out (default, from memory) and should keep 1/8 in past the apron: the limit is 1-3/8 in, so the
  // stool and apron are refitted. The 30 in sill lies inside the 5-1/4 to 40 in band.
  it('refits the stool under board and batten and prices it per window', () => {
    const e = estimate(wall('board-and-batten'), rb);
    const room = e.takeoff.rooms[0]!;
    expect(room.stoolRefits).toBe(1);
    // Demo rate: 1.5 h per window (invented).
    const line = e.price.labour.find((l) => l.task === 'stool-refit')!;
    expect(line.hours).toBeCloseTo(1.5, 9);
    expect(line.basis).toMatch(/1 windows? × 1.5 h/);
    expect(e.price.lines.some((l) => l.group === 'labour' && /stool/i.test(l.label))).toBe(true);
    expect(e.takeoff.notes.join(' ')).toMatch(/Window wall.*stool/);
  });

  // Source: docs/sources.md §5 — 40 CFR 745.83: a removed painted component counts in full.
  it('counts the stool and apron that come off as disturbed paint', () => {
    // Apron: 36 + 2 × 2.25 = 40.5 in long, 2.25 in tall = 91.125 sq in; stool top where it stands out
    // from the wall: 40.5 × 1.5 = 60.75 sq in; 151.875 sq in = 1.0547 sq ft. The baseboard comes off
    // as well (board and batten stands proud of it and it is reset: 12 ft × 5.25 in = 5.25 sq ft), so
    // 6.3047 sq ft in all, past the 6 sq ft minor-repair limit where 5.25 alone was not.
    const room = estimate(wall('board-and-batten'), rb).takeoff.rooms[0]!;
    expect(room.disturbedPaintSqFt).toBeCloseTo(5.25 + 151.875 / 144, 9);
  });

  it('counts each counted window once', () => {
    // Two windows only counted (placed from the left end, geometry.ts): two stools.
    expect(estimate(wall('board-and-batten', 40, 30, 2), rb).takeoff.rooms[0]!.stoolRefits).toBe(2);
  });

  it('leaves the stool alone under thin work, above the band, and under picture frames', () => {
    // Beadboard: 1/4 in + 11/16 in apron = 15/16 in, inside the 1-3/8 in limit.
    expect(estimate(wall('beadboard'), rb).takeoff.rooms[0]!.stoolRefits).toBeUndefined();
    // A 44 in sill stands above a 40 in wainscot: the work stops under the apron's level, no stool met.
    expect(estimate(wall('board-and-batten', 40, 44), rb).takeoff.rooms[0]!.stoolRefits).toBeUndefined();
    // Picture frames stand clear of the trim (margin), so the apron stays on the old wall.
    expect(estimate(wall('picture-frame'), rb).takeoff.rooms[0]!.stoolRefits).toBeUndefined();
  });

  it('an owner whose stools stand further out sets it, and nothing is refitted', () => {
    const deep = sampleRateBook();
    deep.catalogue.stoolProjection = 2;
    expect(estimate(wall('board-and-batten'), parseRateBook(deep)).takeoff.rooms[0]!.stoolRefits).toBeUndefined();
  });

  it('an older rate book without the new fields still parses, with the default projection and no labour', () => {
    const old = sampleRateBook();
    delete (old.catalogue as { stoolProjection?: number }).stoolProjection;
    delete (old.labour as { hoursPerStoolRefit?: number }).hoursPerStoolRefit;
    const e = estimate(wall('board-and-batten'), parseRateBook(old));
    expect(e.takeoff.rooms[0]!.stoolRefits).toBe(1);
    expect(e.price.labour.some((l) => l.task === 'stool-refit')).toBe(false);
  });
});
