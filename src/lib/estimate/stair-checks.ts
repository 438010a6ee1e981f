/**
 * The checks a stair wall needs beyond its schema: the stair fits the wall and the ceiling, the
 * treatment can be priced on a rake, and no door, window or fixture sits over the stair.
 */
import { tryPlaceFixtures } from './fixtures.ts';
import { DEFAULT_DOOR, DEFAULT_WINDOW } from './geometry.ts';
import type { Catalogue, Room, Treatment, Wall } from './schemas.ts';
import { stairErrors, type Stair } from './stair-wall.ts';
import { bandTopFor } from './wall-band.ts';
import { formatLength, type Units } from './units.ts';

/** The skirt board on a stair wall: the rate book's, else the baseboard. Its width is the band's bottom above the nosing line. */
export function skirtStock(c: Catalogue): { id: string; name: string; width: number; length: number } {
  const id = c.skirtBoardId ?? c.baseboardId;
  const stock = c.boards.find((b) => b.id === id) ?? c.mouldings.find((m) => m.id === id);
  return stock ? { id: stock.id, name: stock.name, width: stock.width, length: stock.length } : { id, name: id, width: 0, length: 96 };
}

/** The stretch of the wall [x0, x1] under the stair's rake (from the wall's left end). */
export function rakedSpan(length: number, stair: Stair): [number, number] {
  const run = Math.min(length, stair.steps * stair.run);
  return stair.startsAt === 'left' ? [0, run] : [length - run, length];
}

/**
 * Field errors (full paths under `wp`) for a stair on this wall. `openings` are the wall's doors and
 * windows as placed (validate.ts), casings included in the check.
 */
export function stairWallProblems(a: {
  room: Room;
  wall: Wall & { stair: Stair };
  wallName: string;
  wp: string;
  length: number;
  treatment: Treatment | undefined;
  catalogue: Catalogue;
  openings: Array<{ kind: string; offset: number; width: number; casingWidth?: number }>;
  units: Units;
}): Record<string, string> {
  const { room, wall, wallName, wp, length, catalogue, units } = a;
  const stair = wall.stair;
  const len = (x: number): string => formatLength(x, units);
  const out: Record<string, string> = {};
  const full = room.treatment.height === 'full';
  const top = bandTopFor(room);
  for (const [k, v] of Object.entries(
    stairErrors(wallName, length, stair, units, { skirt: skirtStock(catalogue).width, ceiling: room.ceilingHeight, full, wainscot: top }),
  ))
    out[`${wp}.${k}`] = v;
  if (a.treatment?.kind === 'picture-frame') {
    out[`${wp}.stair`] =
      `${wallName}: picture-frame moulding on a stair wall is not priced online, because frames along a rake are set out on site, each one to the stair's angle. Choose another finish for this room, or ask the firm to measure on site.`;
  }
  if (a.treatment?.kind === 'shiplap' && a.treatment.orientation === 'horizontal' && full) {
    out[`${wp}.stair`] =
      `${wallName}: horizontal boards to the ceiling on a stair wall are not priced online, because every course under the rake is a different length with its own angled ends. Choose a wainscot height, vertical boards, or ask the firm to measure on site.`;
  }
  if (Object.keys(out).length > 0) return out;
  // Doors and windows stand on the landing, which is the stair's climb above the foot (docs/sources.md §40).
  const climb = stair.steps * stair.rise;
  wall.openings.forEach((o, i) => {
    const d = o.kind === 'door' ? DEFAULT_DOOR : DEFAULT_WINDOW;
    const topAbove = (o.sillHeight ?? d.sillHeight) + (o.height ?? d.height);
    if (climb + topAbove > room.ceilingHeight + 1e-6)
      out[`${wp}.openings.${i}.height`] =
        `${wallName}: this opening stands on the landing, ${len(climb)} above the foot of the stair, so its top (${len(topAbove)} above the landing) would be above the ${len(room.ceilingHeight)} ceiling.`;
  });
  if (Object.keys(out).length > 0) return out;
  // Over the stair there is no floor for a door, and the band's cuts at the rake leave no room for an
  // opening's returns: doors, windows and fixtures go on the level part of the wall.
  const [x0, x1] = rakedSpan(length, stair);
  const over = (o: { offset: number; width: number; casingWidth?: number }): boolean => {
    const c = o.casingWidth ?? 0;
    return Math.min(x1, o.offset + o.width + c) - Math.max(x0, o.offset - c) > 1e-6;
  };
  const clear = `The stair takes ${len(x0)} to ${len(x1)} from the left end`;
  const openingsOver = a.openings.filter(over);
  if (openingsOver.length > 0) {
    const what = openingsOver.map((o) => `${o.kind === 'door' ? 'a door' : 'a window'} at ${len(o.offset)}`).join(', ');
    out[`${wp}.openings`] =
      `${wallName}: ${what} would sit over the stair. ${clear}; give each door or window its distance from the left end on the level part of the wall.`;
  }
  const fixtures = tryPlaceFixtures(wall.fixtures, length, a.openings);
  if (fixtures.ok && fixtures.fixtures.some(over)) {
    out[`${wp}.fixtures`] =
      `${wallName}: a fixture would sit over the stair. ${clear}; give each fixture its distance from the left end on the level part of the wall.`;
  }
  return out;
}
