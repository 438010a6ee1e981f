/**
 * The estimate as a carpenter's takeoff, for the inquiry page: what goes on each wall (boards or
 * sheets, trim, openings, boxes, fixtures), a subtotal per room and a total for the job, counted
 * from the core's own takeoff so the page and the price can never disagree.
 */
import type { RoomTakeoff, WallTakeoff } from '~/lib/estimate/types.ts';

export type TakeoffQuantities = {
  netSqFt: number;
  /** Boards or strips across the wall (their layout), or sheets/panels. */
  boards: number;
  sheets: number;
  /** Battens, stiles and rails, as pieces; picture frames as frames. */
  trimPieces: number;
  frames: number;
  capRailFeet: number;
  baseboardFeet: number;
  doors: number;
  windows: number;
  /** Outlets and switches on the wall, and the cut-outs the covered ones need. */
  boxes: number;
  cutOuts: number;
  fixtures: number;
};

export type WallRow = TakeoffQuantities & { label: string; length: number; coveredHeight: number };
export type RoomRows = { name: string; walls: WallRow[]; total: TakeoffQuantities & { insideCorners: number; outsideCorners: number } };

const ZERO: TakeoffQuantities = {
  netSqFt: 0,
  boards: 0,
  sheets: 0,
  trimPieces: 0,
  frames: 0,
  capRailFeet: 0,
  baseboardFeet: 0,
  doors: 0,
  windows: 0,
  boxes: 0,
  cutOuts: 0,
  fixtures: 0,
};

export function wallRow(wall: WallTakeoff): WallRow {
  const pieces = (roles: string[]) => wall.pieces.filter((p) => roles.includes(p.role)).length;
  return {
    label: wall.label,
    length: wall.length,
    coveredHeight: wall.coveredHeight,
    netSqFt: wall.netSqFt,
    // A board layout says how many boards run across; without one, count the laid pieces.
    boards: wall.boards ? wall.boards.count : pieces(['board', 'strip']),
    sheets: pieces(['panel']),
    trimPieces: pieces(['batten', 'stile', 'rail']),
    frames: wall.frames?.count ?? 0,
    capRailFeet: wall.capRailFeet,
    baseboardFeet: wall.baseboardFeet,
    doors: wall.openings.filter((o) => o.kind === 'door').length,
    windows: wall.openings.filter((o) => o.kind === 'window').length,
    boxes: wall.boxes.length,
    cutOuts: wall.cutOuts,
    fixtures: wall.fixtures?.length ?? 0,
  };
}

export function sumQuantities(rows: readonly TakeoffQuantities[]): TakeoffQuantities {
  const total = { ...ZERO };
  for (const row of rows) for (const key of Object.keys(ZERO) as (keyof TakeoffQuantities)[]) total[key] += row[key];
  return total;
}

export function roomRows(room: RoomTakeoff): RoomRows {
  const walls = room.walls.map(wallRow);
  return { name: room.name, walls, total: { ...sumQuantities(walls), insideCorners: room.insideCorners, outsideCorners: room.outsideCorners } };
}

/** Every room's rows and the job's total (corners included). */
export function takeoffRows(rooms: readonly RoomTakeoff[]): { rooms: RoomRows[]; total: RoomRows['total'] } {
  const rows = rooms.map(roomRows);
  const total = {
    ...sumQuantities(rows.map((r) => r.total)),
    insideCorners: rows.reduce((n, r) => n + r.total.insideCorners, 0),
    outsideCorners: rows.reduce((n, r) => n + r.total.outsideCorners, 0),
  };
  return { rooms: rows, total };
}
