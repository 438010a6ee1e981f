/** How many corners a room's covered walls meet at, when the room does not say. */
import type { Wall } from './schemas.ts';

/**
 * Inside corners between the walls actually covered. For walls given by the side of the room they are
 * on, walls next to each other in the list on different sides meet at an inside corner, and the last
 * meets the first when the walls close the room (four or more, sides alternating all the way round);
 * two walls on the same side face each other (a hallway's long walls) and meet at no corner. Walls
 * given by a length keep the older rule: four or more usually close a room, fewer are joined in a
 * line. See docs/sources.md §21 (plain geometry; the older rule is common practice, no source).
 */
export function defaultInsideCorners(walls: Array<Pick<Wall, 'side' | 'length'>>): number {
  const n = walls.length;
  if (n === 0) return 0;
  if (walls.some((w) => w.side === undefined || w.length !== undefined)) return n >= 4 ? n : Math.max(0, n - 1);
  let corners = 0;
  for (let i = 1; i < n; i++) if (walls[i]!.side !== walls[i - 1]!.side) corners++;
  const closes = n >= 4 && corners === n - 1 && walls[n - 1]!.side !== walls[0]!.side;
  return closes ? corners + 1 : corners;
}
