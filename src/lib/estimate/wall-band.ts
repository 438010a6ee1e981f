/** Where a wall's covered band sits and how long the wall is, from the room's answers. */
import type { Room, Wall } from './schemas.ts';

/** Top of the covered band: the wainscot height (one third of the ceiling when not given) or the ceiling. */
export function bandTopFor(room: Room): number {
  if (room.treatment.height === 'full') return room.ceilingHeight;
  // Source: docs/sources.md §8 — rule of thirds, cap at about one third of the wall height (This Old House).
  return room.treatment.wainscotHeight ?? Math.round(room.ceilingHeight / 3);
}

export function wallLength(room: Room, wall: Wall): number {
  if (wall.length !== undefined) return wall.length;
  return wall.side === 'width' ? room.width! : room.length!;
}
