/**
 * The size of a project, worked out from its answers before any wall is laid out, and the limits an
 * online estimate keeps to. Every project the schema allows is priced in bounded time: the work of a
 * takeoff grows with walls, openings, boxes and above all the pieces of material laid on the walls,
 * so a project past these limits is refused with the field named instead of being computed.
 */
import { EstimateInputError } from './errors.ts';
import { DEFAULT_DOOR, DEFAULT_WINDOW } from './geometry.ts';
import { treatmentForRoom } from './damp-stock.ts';
import type { Catalogue, Project, Room, Treatment } from './schemas.ts';
import { shortestJoinedPiece } from './staggered-joints.ts';
import { nosingLineLength } from './stair-wall.ts';
import { bandTopFor, wallLength } from './wall-band.ts';

/**
 * Limits well above any real home (common practice, no source): a large house of 20 rooms with six
 * walls each, every wall 20 ft long under 9 ft ceilings and covered to the ceiling in 6 in boards,
 * has 120 walls, about 21,600 sq ft of covered wall and about 10,000 pieces on the walls.
 */
export const PROJECT_LIMITS = {
  /** Walls in the whole project. */
  walls: 120,
  /** Doors and windows in the whole project, each counted one on its own. */
  openings: 400,
  /** Outlets and switches in the whole project. */
  boxes: 800,
  /** Covered wall area (before openings) in the whole project, sq ft. */
  coveredSqFt: 30_000,
  /** Covered wall area in one room, sq ft. */
  roomCoveredSqFt: 8_000,
  /** Pieces of material laid on the walls (boards, strips, panels, trim), whole project. */
  pieces: 25_000,
  /** Pieces of material laid on the walls of one room. */
  roomPieces: 8_000,
} as const;

export type ProjectLimits = { [K in keyof typeof PROJECT_LIMITS]: number };

export interface RoomSize {
  walls: number;
  openings: number;
  boxes: number;
  coveredSqFt: number;
  /** An upper estimate of the pieces the takeoff lays on this room's walls. */
  pieces: number;
}

export interface ProjectSize extends RoomSize {
  rooms: RoomSize[];
}

const ceilDiv = (a: number, b: number): number => Math.max(0, Math.ceil(a / b - 1e-9));

/**
 * Pieces laid in courses across a run (rows of boards, columns of strips or panels, uprights), each
 * course split at the stock length. An opening breaks each course it crosses in two and adds
 * slices at its two edges.
 */
function coursePieces(run: number, pitch: number, courseLength: number, stockLength: number, openingSpans: number[]): number {
  const courses = ceilDiv(run, pitch);
  const perCourse = Math.max(1, ceilDiv(courseLength, stockLength));
  const broken = openingSpans.reduce((s, span) => s + ceilDiv(span, pitch) + 3, 0);
  return courses * perCourse + broken;
}

function wallPieces(room: Room, length: number, openings: Array<{ width: number; height: number }>, t: Treatment, c: Catalogue): number {
  const baseboard = c.mouldings.find((m) => m.id === c.baseboardId);
  const bottom = baseboard?.width ?? 0;
  const height = Math.max(0, bandTopFor(room) - bottom);
  const k = openings.length;
  // Baseboard and cap rail, each broken at openings.
  let pieces = 2 * (k + 1);
  const board = (id: string) => c.boards.find((b) => b.id === id);
  const sheet = (id: string) => c.sheets.find((s) => s.id === id);
  const panels = (sheetId: string | undefined): void => {
    const s = sheetId ? sheet(sheetId) : undefined;
    if (s)
      pieces += coursePieces(
        length,
        s.width,
        height,
        Math.max(s.width, s.height),
        openings.map((o) => o.width),
      );
  };
  const uprights = (id: string, spacing: number): void => {
    const b = board(id);
    if (b)
      pieces += coursePieces(
        length + spacing,
        spacing,
        height,
        b.length,
        openings.map((o) => o.width),
      );
  };
  const rail = (id: string | undefined): void => {
    const b = id ? board(id) : undefined;
    if (b) pieces += ceilDiv(length, shortestJoinedPiece(b.length, c.studSpacing)) + 1 + k;
  };
  switch (t.kind) {
    case 'shiplap': {
      const b = t.source.from === 'boards' ? board(t.source.boardId) : undefined;
      const s = t.source.from === 'sheet' ? sheet(t.source.sheetId) : undefined;
      const face = t.source.from === 'sheet' ? t.source.stripWidth : (b?.faceWidth ?? 1);
      const stock = s ? Math.max(s.width, s.height) : (b?.length ?? 1);
      const pitch = face + t.gap;
      pieces +=
        t.orientation === 'horizontal'
          ? coursePieces(
              height,
              pitch,
              length,
              // Joints on studs, staggered: pieces can be shorter than the stock (staggered-joints.ts).
              shortestJoinedPiece(stock, c.studSpacing),
              openings.map((o) => o.height),
            )
          : coursePieces(
              length,
              pitch,
              height,
              stock,
              openings.map((o) => o.width),
            );
      break;
    }
    case 'beadboard':
      panels(t.sheetId);
      break;
    case 'board-and-batten':
      panels(t.backingSheetId);
      uprights(t.battenId, t.battenSpacing);
      rail(t.topRailId);
      break;
    case 'flat-panel':
      panels(t.backingSheetId);
      uprights(t.stileId, t.stileSpacing);
      rail(t.railId);
      rail(t.railId);
      break;
    case 'picture-frame': {
      const rows = room.treatment.height === 'wainscot' ? 1 : t.fullHeightRows;
      pieces += rows * (ceilDiv(length, t.targetFrameWidth + t.frameGap) + k + 1);
      break;
    }
  }
  return pieces;
}

/** Walls, openings, boxes, covered area and an upper estimate of the pieces, per room and in all. */
export function projectSize(project: Project, catalogue: Catalogue): ProjectSize {
  const baseboard = catalogue.mouldings.find((m) => m.id === catalogue.baseboardId);
  const rooms = project.rooms.map((room): RoomSize => {
    // A damp room is laid out in the firm's damp-room alternative, so bound the treatment the takeoff uses.
    const t = catalogue.treatments.some((x) => x.id === room.treatment.id) ? treatmentForRoom(room, catalogue).treatment : undefined;
    const size: RoomSize = { walls: room.walls.length, openings: 0, boxes: 0, coveredSqFt: 0, pieces: 0 };
    for (const wall of room.walls) {
      const length = wallLength(room, wall) ?? 0;
      const openings = wall.openings.flatMap((o) => {
        const d = o.kind === 'door' ? DEFAULT_DOOR : DEFAULT_WINDOW;
        return Array.from({ length: o.count }, () => ({ width: o.width ?? d.width, height: o.height ?? d.height }));
      });
      size.openings += openings.length;
      size.boxes += wall.outlets + wall.switches;
      size.coveredSqFt += (length * Math.max(0, bandTopFor(room) - (baseboard?.width ?? 0))) / 144;
      // Along a stair, rails and courses follow the rake and are longer than the wall (stair-wall.ts).
      if (t) size.pieces += wallPieces(room, wall.stair ? nosingLineLength(length, wall.stair) : length, openings, t, catalogue);
    }
    return size;
  });
  const sum = (f: (r: RoomSize) => number): number => rooms.reduce((s, r) => s + f(r), 0);
  return {
    rooms,
    walls: sum((r) => r.walls),
    openings: sum((r) => r.openings),
    boxes: sum((r) => r.boxes),
    coveredSqFt: sum((r) => r.coveredSqFt),
    pieces: sum((r) => r.pieces),
  };
}

const n = (x: number): string => Math.round(x).toLocaleString('en-US');
const SPLIT = 'Split the house into several estimates, or ask the firm to measure on site.';

/**
 * Refuses a project too big to price online, before any wall is laid out: throws EstimateInputError
 * naming `rooms` (the project as a whole) or `rooms.N.walls` (one room), with what is too big.
 * `limits` defaults to PROJECT_LIMITS.
 */
export function checkProjectSize(project: Project, catalogue: Catalogue, limits: ProjectLimits = PROJECT_LIMITS): ProjectSize {
  const size = projectSize(project, catalogue);
  const fields: Record<string, string> = {};
  size.rooms.forEach((room, r) => {
    const path = `rooms.${r}.walls`;
    if (room.coveredSqFt > limits.roomCoveredSqFt) {
      fields[path] =
        `These walls cover about ${n(room.coveredSqFt)} sq ft; an online estimate takes at most ${n(limits.roomCoveredSqFt)} sq ft in one room. Check the wall lengths and ceiling height.`;
    } else if (room.pieces > limits.roomPieces) {
      fields[path] =
        `These walls would take about ${n(room.pieces)} boards and pieces; an online estimate lays out at most ${n(limits.roomPieces)} in one room. Check the wall lengths and ceiling height, or split the room.`;
    }
  });
  const whole: string[] = [];
  if (size.walls > limits.walls) whole.push(`${n(size.walls)} walls (at most ${n(limits.walls)})`);
  if (size.openings > limits.openings) whole.push(`${n(size.openings)} doors and windows (at most ${n(limits.openings)})`);
  if (size.boxes > limits.boxes) whole.push(`${n(size.boxes)} outlets and switches (at most ${n(limits.boxes)})`);
  if (size.coveredSqFt > limits.coveredSqFt) whole.push(`about ${n(size.coveredSqFt)} sq ft of covered wall (at most ${n(limits.coveredSqFt)})`);
  if (size.pieces > limits.pieces) whole.push(`about ${n(size.pieces)} boards and pieces (at most ${n(limits.pieces)})`);
  if (whole.length > 0) fields.rooms = `This project is too big for one online estimate: ${whole.join(', ')}. ${SPLIT}`;
  if (Object.keys(fields).length > 0) throw new EstimateInputError(fields, 'This project is too big for one online estimate.');
  return size;
}
