/**
 * The widget's form state from a stored project: the inverse of `toProject` (draft.ts), so the
 * rooms an inquiry came with can be opened again in the same form (the measured rooms after a site
 * visit start from the homeowner's). Rooms given by length and width with walls by side open in
 * room mode, other rooms wall by wall; an accent wall's room (`<room> — accent wall`) folds back
 * into its room; each wall keeps its own doors, windows, outlets, switches and fixtures.
 *
 * The form counts openings and fixtures, so sizes and positions given for them are not carried
 * over (the core places counted ones by its usual rules); nor are corner counts.
 */
import { formatLength, type Units } from '~/lib/estimate/units.ts';
import type { ProjectInput } from '~/lib/estimate/schemas.ts';
import { roomWallNames, ROOM_SIDES } from '~/lib/shared/wall-names.ts';
import { ACCENT_SUFFIX, newDraft, newKey, newRoom, noItems, type Draft, type FinishDraft, type RoomDraft, type WallDraft, type WallItems } from './draft';

type ProjectRoom = ProjectInput['rooms'][number];
type ProjectWall = ProjectRoom['walls'][number];
type Treatment = ProjectRoom['treatment'];

const lengthText = (inches: number | undefined, units: Units): string => (inches === undefined ? '' : formatLength(inches, units));

function itemsOf(wall: ProjectWall): WallItems {
  const count = (kind: 'door' | 'window') => (wall.openings ?? []).filter((o) => o.kind === kind).reduce((sum, o) => sum + (o.count ?? 1), 0);
  return {
    doors: count('door'),
    windows: count('window'),
    outlets: wall.outlets ?? 0,
    switches: wall.switches ?? 0,
    fixtures: (wall.fixtures ?? []).map((f) => f.kind),
  };
}

const finishOf = (treatment: Treatment, units: Units): FinishDraft => ({
  treatmentId: treatment.id,
  height: treatment.height,
  wainscotHeight: treatment.height === 'wainscot' ? lengthText(treatment.wainscotHeight, units) : '',
});

const sameFinish = (a: FinishDraft, b: FinishDraft) => a.treatmentId === b.treatmentId && a.height === b.height && a.wainscotHeight === b.wainscotHeight;

/** Room mode fits a room with both sizes whose walls all go by side, at most two of each. */
function inRoomMode(room: ProjectRoom): boolean {
  if (room.length === undefined || room.width === undefined) return false;
  const sides = room.walls.map((w) => w.side);
  return sides.every((s) => s !== undefined) && sides.filter((s) => s === 'length').length <= 2 && sides.filter((s) => s === 'width').length <= 2;
}

/** Which of the four room walls each project wall is: by its name when it has the form's own, else the next free one on its side. */
function roomWallIndexes(room: ProjectRoom): number[] {
  const names = roomWallNames(room.length, room.width);
  const taken = new Set<number>();
  const byName = room.walls.map((w) => {
    const i = w.label ? names.indexOf(w.label as (typeof names)[number]) : -1;
    if (i >= 0 && ROOM_SIDES[i] === w.side && !taken.has(i)) {
      taken.add(i);
      return i;
    }
    return -1;
  });
  return byName.map((i, w) => {
    if (i >= 0) return i;
    const free = ROOM_SIDES.findIndex((side, j) => side === room.walls[w]!.side && !taken.has(j));
    taken.add(free);
    return free;
  });
}

function wallDraft(items: WallItems, length: string, covered: boolean): WallDraft {
  return { key: newKey(), length, covered, ...items };
}

/** The room's own draft from its main room and, when it has one, its accent wall's room. */
function roomDraft(main: ProjectRoom | null, accent: ProjectRoom | null, name: string, units: Units): { room: RoomDraft; finish: FinishDraft } {
  const base = main ?? accent!;
  const room: RoomDraft = { ...newRoom(units, name), ceilingHeight: lengthText(base.ceilingHeight, units), placement: 'by-wall', damp: base.damp ?? false };
  const walls = [...(main?.walls ?? []), ...(accent?.walls ?? [])];
  const whole: ProjectRoom = { ...base, walls };
  if (inRoomMode(whole)) {
    const indexes = roomWallIndexes(whole);
    const roomWalls = [0, 1, 2, 3].map(() => wallDraft(noItems(), '', false)) as RoomDraft['roomWalls'];
    walls.forEach((wall, w) => (roomWalls[indexes[w]!] = wallDraft(itemsOf(wall), '', true)));
    Object.assign(room, { mode: 'room', length: lengthText(base.length, units), width: lengthText(base.width, units), roomWalls });
    if (accent) room.accent = { wall: indexes[walls.length - 1]!, finish: finishOf(accent.treatment, units) };
  } else {
    const sideLength = (wall: ProjectWall) => wall.length ?? (wall.side === 'width' ? base.width : base.length);
    // The form names listed walls "Wall 1", "Wall 2"…: walls named so go back to those places.
    const numbers = walls.map((w) => Number(/^Wall (\d+)$/.exec(w.label ?? '')?.[1] ?? NaN));
    const numbered = numbers.every((n) => n >= 1) && new Set(numbers).size === numbers.length;
    const order = walls.map((_, w) => w).sort((a, b) => (numbered ? numbers[a]! - numbers[b]! : a - b));
    room.mode = 'walls';
    room.walls = order.map((w) => wallDraft(itemsOf(walls[w]!), lengthText(sideLength(walls[w]!), units), true));
    if (accent) room.accent = { wall: order.indexOf(walls.length - 1), finish: finishOf(accent.treatment, units) };
  }
  if (walls.some((w) => (w.fixtures ?? []).length > 0)) room.hasFixtures = true;
  return { room, finish: finishOf((main ?? accent!).treatment, units) };
}

/** A draft that `toProject` turns back into the same rooms (up to the details listed above). */
export function draftFromProject(project: ProjectInput, units: Units): Draft {
  const groups: { name: string; main: ProjectRoom | null; accent: ProjectRoom | null }[] = [];
  for (const room of project.rooms) {
    if (room.name.endsWith(ACCENT_SUFFIX) && room.walls.length === 1) {
      const owner = room.name.slice(0, -ACCENT_SUFFIX.length);
      const group = groups.at(-1);
      if (group && !group.accent && group.main && group.main.name.startsWith(owner)) group.accent = room;
      else groups.push({ name: owner, main: null, accent: room });
    } else groups.push({ name: room.name, main: room, accent: null });
  }
  const draft = newDraft(units);
  const rooms = groups.map((g) => roomDraft(g.main, g.accent, g.name, units));
  const first = rooms[0]?.finish ?? { treatmentId: null, height: 'wainscot', wainscotHeight: '' };
  rooms.forEach((r, i) => (r.room.finish = i === 0 || sameFinish(r.finish, first) ? null : r.finish));
  return {
    ...draft,
    rooms: rooms.length ? rooms.map((r) => r.room) : draft.rooms,
    treatmentId: first.treatmentId,
    height: first.height,
    wainscotHeight: first.wainscotHeight,
    replaceBaseboard: project.rooms.some((r) => r.replaceBaseboard === true),
    paint: project.paint ?? false,
    builtBefore1978: project.builtBefore1978,
    measuredBy: project.measuredBy === 'homeowner-estimate' ? 'homeowner-estimate' : 'homeowner-tape',
  };
}
