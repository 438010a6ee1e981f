/**
 * The names the homeowner sees for walls, used by the widget's steps, its drawings' captions,
 * the lead and the e-mails, so a wall is called the same thing everywhere.
 *
 * In "room length × width" mode the four walls go clockwise from a wall along the room's length:
 * length, width, length, width. They are named by what they are in that room (long or short);
 * a square room (or one whose sizes are not known yet) gets "Wall 1" … "Wall 4".
 */
export type RoomSide = 'length' | 'width';

export const ROOM_SIDES: readonly RoomSide[] = ['length', 'width', 'length', 'width'];

export function roomWallNames(length?: number, width?: number): [string, string, string, string] {
  if (length === undefined || width === undefined || length === width) return ['Wall 1', 'Wall 2', 'Wall 3', 'Wall 4'];
  const [alongLength, alongWidth] = length > width ? ['Long wall', 'Short wall'] : ['Short wall', 'Long wall'];
  return [`${alongLength} 1`, `${alongWidth} 1`, `${alongLength} 2`, `${alongWidth} 2`];
}

/** "Wall by wall" mode: the walls in the order they were typed. */
export function listedWallNames(count: number): string[] {
  return Array.from({ length: count }, (_, i) => `Wall ${i + 1}`);
}
