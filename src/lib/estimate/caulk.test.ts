/** Feet of caulk: each joint between the new work and the wall, the trim or the ceiling counted once. */
import { describe, expect, it } from 'vitest';
import { estimate, sampleRateBook } from './index.ts';

describe('caulk on flat-panel wainscot', () => {
  it('counts each joint once in a 12 × 14 ft dining room', () => {
    const e = estimate(
      {
        rooms: [
          {
            name: 'Dining room',
            ceilingHeight: 96,
            length: 168,
            width: 144,
            walls: [{ side: 'length' }, { side: 'width' }, { side: 'length' }, { side: 'width' }],
            treatment: { id: 'flat-panel', height: 'wainscot' },
          },
        ],
        builtBefore1978: 'no',
        measuredBy: 'site-measure',
      },
      sampleRateBook(),
    );
    // Worked by hand (common practice, no source: a bead along every edge where trim meets the wall,
    // the trim or another trim, once per joint):
    //   Wainscot top: one third of the 96 in ceiling = 32 in; band 5.25–32 in (26.75 in) over the
    //   5-1/4 in baseboard. Rails and stiles are 1x4, 3-1/2 in wide (Source: DOC PS 20, American Softwood Lumber Standard, dressed
    //   size of nominal 1x4). Perimeter 2 × (12 + 14) ft = 52 ft.
    //   Cap rail, top and bottom edges (its bottom edge is the top rail's top edge): 2 × 52 = 104 ft.
    //   Top rail, bottom edge only: 52 ft.
    //   Bottom rail, top edge and its bottom edge on the kept baseboard: 2 × 52 = 104 ft.
    //   Stiles, 26.75 − 2 × 3.5 = 19.75 in tall; ceil((144 − 3.5) / 24) + 1 = 7 on a 12 ft wall and
    //   ceil((168 − 3.5) / 24) + 1 = 8 on a 14 ft wall, 30 in all; the 8 at wall ends have one edge
    //   on the corner, the 22 others two: (8 + 44) × 19.75 in = 1027 in = 85.583 ft.
    //   Four inside corners (a closed room: the wall ends are its corners), 26.75 in each: 8.917 ft.
    //   Total: 104 + 52 + 104 + 85.583 + 8.917 = 354.5 ft.
    expect(e.takeoff.rooms[0]!.caulkFeet).toBeCloseTo(354.5, 2);
  });
});
