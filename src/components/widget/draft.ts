/**
 * The widget's form state ("draft") and its translation into the estimating core's project input.
 * Lengths stay as the homeowner typed them (tape style) until they are parsed here.
 *
 * Each wall carries its own doors, windows, outlets, switches and fixtures. A homeowner who only
 * counts can leave the placing to us: each item goes on the longest covered wall it fits on, and the
 * step says where (`placeForMe`). Each room has its own finish (or the first room's), and may have one
 * accent wall in another finish, sent to the core as an extra room holding just that wall.
 */
import { defaultInsideCorners } from '~/lib/estimate/corners.ts';
import type { FixtureKind, ProjectInput } from '~/lib/estimate/schemas.ts';
import { parseLength, type Units } from '~/lib/estimate/units.ts';
import { listedWallNames, roomWallNames, ROOM_SIDES } from '~/lib/shared/wall-names.ts';
import { contentsWidth, fitProblem, fits, type WallContents } from './wall-fit';
import type { WaitingContext } from './waiting-for';

export type SizeMode = 'room' | 'walls';

/** What is on one wall. */
export type WallItems = { doors: number; windows: number; outlets: number; switches: number; fixtures: FixtureKind[] };

export type WallDraft = WallItems & {
  key: string;
  /** Typed length ("wall by wall" mode); the room's length or width in room mode. */
  length: string;
  /** Room mode: whether the treatment goes on this wall. */
  covered: boolean;
};

export type FinishDraft = { treatmentId: string | null; height: 'wainscot' | 'full'; wainscotHeight: string };

export type RoomDraft = {
  key: string;
  name: string;
  mode: SizeMode;
  length: string;
  width: string;
  /** Room mode: the four walls clockwise from a wall along the room's length (see wall-names.ts). */
  roomWalls: [WallDraft, WallDraft, WallDraft, WallDraft];
  /** "Wall by wall" mode. */
  walls: WallDraft[];
  ceilingHeight: string;
  /** 'auto': the homeowner only counts (`counts`), we place; 'by-wall': each wall's own items. */
  placement: 'auto' | 'by-wall';
  counts: WallItems;
  /** Null until the homeowner ticks or unticks it: then the room's name proposes it. */
  damp: boolean | null;
  /** Null: offered when the name says bathroom, kitchen, laundry…; else the homeowner's choice. */
  hasFixtures: boolean | null;
  /** Null: the first room's finish (the draft's own). Always null for the first room. */
  finish: FinishDraft | null;
  /** One wall in another finish; `wall` indexes roomWalls or walls, null until chosen. */
  accent: { wall: number | null; finish: FinishDraft } | null;
};

export type Draft = {
  rooms: RoomDraft[];
  /** The first room's finish, offered as every other room's. */
  treatmentId: string | null;
  height: 'wainscot' | 'full';
  wainscotHeight: string;
  replaceBaseboard: boolean;
  paint: boolean;
  /** Null until the homeowner answers: a guessed "no" would hide the lead-paint caution. */
  builtBefore1978: 'yes' | 'no' | 'not-sure' | null;
  measuredBy: 'homeowner-estimate' | 'homeowner-tape';
};

let counter = 0;
// A random part as well as a count: a draft kept in the browser and read back after a reload must
// not share keys with rooms and walls added after it (React keys only, never in the markup).
const session = Math.random().toString(36).slice(2, 8);
export const newKey = (): string => `k${session}${++counter}`;

export const noItems = (): WallItems => ({ doors: 0, windows: 0, outlets: 0, switches: 0, fixtures: [] });
export const newWall = (covered = true): WallDraft => ({ key: newKey(), length: '', covered, ...noItems() });

/** A room with nothing filled in: the fields show example placeholders, never sample answers. */
export function newRoom(_units?: Units, name = ''): RoomDraft {
  return {
    key: newKey(),
    name,
    mode: 'room',
    length: '',
    width: '',
    roomWalls: [newWall(), newWall(), newWall(), newWall()],
    walls: [newWall()],
    ceilingHeight: '',
    placement: 'auto',
    counts: noItems(),
    damp: null,
    hasFixtures: null,
    finish: null,
    accent: null,
  };
}

export function newDraft(units: Units): Draft {
  return {
    rooms: [newRoom(units)],
    treatmentId: null,
    height: 'wainscot',
    wainscotHeight: '',
    replaceBaseboard: false,
    paint: true,
    builtBefore1978: null,
    measuredBy: 'homeowner-estimate',
  };
}

// Rooms whose names say they get damp: bathrooms, laundries, utility and shower rooms (the wet
// rooms of common practice, no source).
const DAMP_NAMES = /\b(bath|bathroom|washroom|wash room|laundry|shower|shower room|utility|wc|toilet|powder room|ensuite|en-suite|mud ?room|wet room)\b/i;
// Rooms that usually hold a tub, vanity, toilet or cabinets along a wall.
const FIXTURE_NAMES = /\b(bath|bathroom|washroom|wash room|laundry|shower|utility|wc|toilet|powder room|ensuite|en-suite|kitchen|wet room)\b/i;

export const proposedDamp = (name: string): boolean => DAMP_NAMES.test(name);
export const isDamp = (room: RoomDraft): boolean => room.damp ?? proposedDamp(room.name);
export const offersFixtures = (room: RoomDraft): boolean => room.hasFixtures ?? FIXTURE_NAMES.test(room.name);

/** Field path (as the API names it) → message. */
export type FieldErrors = Record<string, string>;

/** Spreads `total` items over `slots` walls as evenly as possible, first walls first. */
export function spread(total: number, slots: number): number[] {
  return Array.from({ length: slots }, (_, i) => Math.floor(total / slots) + (i < total % slots ? 1 : 0));
}

/** The room's walls in the current mode, with their names and lengths (undefined when not readable). */
export type WallView = { index: number; name: string; length: number | undefined; covered: boolean; wall: WallDraft };

const tryLength = (text: string, units: Units): number | undefined => {
  if (text.trim() === '') return undefined;
  try {
    return parseLength(text, units);
  } catch {
    return undefined;
  }
};

export function roomWalls(room: RoomDraft, units: Units): WallView[] {
  if (room.mode === 'room') {
    const length = tryLength(room.length, units);
    const width = tryLength(room.width, units);
    const names = roomWallNames(length, width);
    return room.roomWalls.map((wall, i) => ({
      index: i,
      name: names[i]!,
      length: ROOM_SIDES[i] === 'length' ? length : width,
      covered: wall.covered,
      wall,
    }));
  }
  const names = listedWallNames(room.walls.length);
  return room.walls.map((wall, i) => ({ index: i, name: names[i]!, length: tryLength(wall.length, units), covered: true, wall }));
}

export type Placement = { items: WallItems[]; notes: string[]; unplaced: string[] };

const fixtureName: Record<FixtureKind, string> = {
  tub: 'tub',
  shower: 'shower',
  vanity: 'vanity',
  toilet: 'toilet',
  radiator: 'radiator',
  'built-in': 'built-in cabinet',
};

/**
 * "Place them for me": each door, window and fixture goes on the longest covered wall it still fits
 * on (widest things first, so a door is not crowded out by windows); outlets and switches are spread
 * over the covered walls, longest first. Returns the items per wall (indexed like `roomWalls`), a
 * note per wall saying what went there, and what fitted nowhere.
 */
export function placeForMe(room: RoomDraft, units: Units): Placement {
  const views = roomWalls(room, units);
  const items = views.map(() => noItems());
  const candidates = views.filter((v) => v.covered && v.length !== undefined).sort((a, b) => b.length! - a.length! || a.index - b.index);
  const unplaced: string[] = [];
  const offer = (thing: { door?: true; window?: true; fixture?: FixtureKind }, label: string) => {
    for (const v of candidates) {
      const here = items[v.index]!;
      const trial: WallContents = {
        doors: here.doors + (thing.door ? 1 : 0),
        windows: here.windows + (thing.window ? 1 : 0),
        fixtures: thing.fixture ? [...here.fixtures, thing.fixture] : here.fixtures,
      };
      if (fits(trial, v.length!)) {
        here.doors = trial.doors;
        here.windows = trial.windows;
        here.fixtures = trial.fixtures;
        return;
      }
    }
    unplaced.push(label);
  };
  const fixtures = offersFixtures(room)
    ? [...room.counts.fixtures].sort((a, b) => contentsWidth({ doors: 0, windows: 0, fixtures: [b] }) - contentsWidth({ doors: 0, windows: 0, fixtures: [a] }))
    : [];
  for (let i = 0; i < room.counts.doors; i++) offer({ door: true }, 'a door');
  for (const f of fixtures) offer({ fixture: f }, `a ${fixtureName[f]}`);
  for (let i = 0; i < room.counts.windows; i++) offer({ window: true }, 'a window');
  const slots = candidates.length ? candidates : views.filter((v) => v.covered);
  const outlets = spread(room.counts.outlets, slots.length);
  const switches = spread(room.counts.switches, slots.length);
  slots.forEach((v, k) => {
    items[v.index]!.outlets = outlets[k]!;
    items[v.index]!.switches = switches[k]!;
  });
  const notes = views.flatMap((v) => {
    const what = describeItems(items[v.index]!);
    return what ? [`${v.name}: ${what}`] : [];
  });
  return { items, notes, unplaced };
}

/** "1 door, 2 windows, tub" — what is on a wall, for notes and the lead. */
export function describeItems(items: WallItems): string {
  const parts = [
    items.doors ? `${items.doors} ${items.doors === 1 ? 'door' : 'doors'}` : '',
    items.windows ? `${items.windows} ${items.windows === 1 ? 'window' : 'windows'}` : '',
    ...items.fixtures.map((f) => fixtureName[f]),
  ].filter(Boolean);
  return parts.join(', ');
}

/** What goes on a wall: the homeowner's own items, or where "Place them for me" put them. */
function wallItems(room: RoomDraft, v: WallView, placed: Placement | null): WallItems {
  const items = placed ? placed.items[v.index]! : v.wall;
  return offersFixtures(room) ? items : { ...items, fixtures: [] };
}

/**
 * The fit rule, wall by wall, under the path of the wall it is about
 * (`project.rooms.R.walls.W.openings`), so the message sits next to that wall. Shown as soon as it
 * is true, not only after "Next": a door that cannot fit is news the homeowner needs at once.
 */
export function wallFitErrors(room: RoomDraft, r: number, units: Units): FieldErrors {
  const errors: FieldErrors = {};
  if (room.placement === 'auto') return errors;
  for (const v of roomWalls(room, units)) {
    if (!v.covered || v.length === undefined) continue;
    const problem = fitProblem(wallItems(room, v, null), v.length, units);
    if (problem) errors[`project.rooms.${r}.walls.${v.index}.openings`] = problem;
  }
  return errors;
}

/** Where each project room came from, to show the server's errors next to the right room and wall. */
export type ProjectOrigin = Array<{ room: number; accent: boolean; walls: number[] }>;

type ProjectRoom = ProjectInput['rooms'][number];
type ProjectWall = NonNullable<ProjectRoom['walls']>[number];

/**
 * Builds the project input for the API. Lengths that do not parse are reported under the same
 * paths the server would use (`project.rooms.0.length`), so one error display serves both; wall
 * paths use the draft's wall numbers (`project.rooms.0.walls.3.openings` is the fourth wall of the
 * room, covered or not), and `origin` maps the project's rooms and walls back to them.
 */
export function toProject(draft: Draft, units: Units): { project: ProjectInput | null; errors: FieldErrors; origin: ProjectOrigin } {
  const errors: FieldErrors = {};
  const origin: ProjectOrigin = [];
  const length = (path: string, text: string, label: string): number | undefined => {
    if (text.trim() === '') {
      errors[path] = `${label} is required.`;
      return undefined;
    }
    try {
      return parseLength(text, units);
    } catch (error) {
      errors[path] = error instanceof Error ? error.message : `${label} is not a length.`;
      return undefined;
    }
  };
  const finishOf = (finish: FinishDraft, at: { treatment: string; wainscotHeight: string }): ProjectRoom['treatment'] => {
    if (!finish.treatmentId) errors[at.treatment] ??= 'Choose a finish.';
    const wainscotHeight = finish.height === 'wainscot' ? length(at.wainscotHeight, finish.wainscotHeight, 'Wainscot height') : undefined;
    return { id: finish.treatmentId ?? '', height: finish.height, ...(wainscotHeight !== undefined ? { wainscotHeight } : {}) };
  };
  const firstFinish: FinishDraft = { treatmentId: draft.treatmentId, height: draft.height, wainscotHeight: draft.wainscotHeight };
  const defaultTreatment = finishOf(firstFinish, { treatment: 'project.treatment', wainscotHeight: 'project.wainscotHeight' });

  const rooms: ProjectRoom[] = [];
  draft.rooms.forEach((room, r) => {
    const at = `project.rooms.${r}`;
    const ceilingHeight = length(`${at}.ceilingHeight`, room.ceilingHeight, 'Ceiling height');
    let roomLength: number | undefined;
    let roomWidth: number | undefined;
    const views = roomWalls(room, units);
    if (room.mode === 'room') {
      roomLength = length(`${at}.length`, room.length, 'Room length');
      roomWidth = length(`${at}.width`, room.width, 'Room width');
      if (!room.roomWalls.some((w) => w.covered)) errors[`${at}.walls`] = 'Choose at least one wall to cover.';
    } else {
      room.walls.forEach((wall, w) => length(`${at}.walls.${w}.length`, wall.length, 'Wall length'));
    }
    const placed = room.placement === 'auto' ? placeForMe(room, units) : null;
    if (placed?.unplaced.length) {
      errors[`${at}.placement`] =
        `We could not find a wall with room for ${placed.unplaced.join(', ')}. Choose the walls yourself, or check the sizes and the walls to cover.`;
    }
    const itemsOf = (v: WallView): WallItems => wallItems(room, v, placed);
    const covered = views.filter((v) => v.covered);
    Object.assign(errors, wallFitErrors(room, r, units));
    const toWall = (v: WallView): ProjectWall => {
      const items = itemsOf(v);
      const base = room.mode === 'room' ? { side: ROOM_SIDES[v.index]! } : { length: v.length ?? 0 };
      return {
        ...base,
        label: v.name,
        openings: [
          ...(items.doors ? [{ kind: 'door' as const, count: items.doors }] : []),
          ...(items.windows ? [{ kind: 'window' as const, count: items.windows }] : []),
        ],
        outlets: items.outlets,
        switches: items.switches,
        fixtures: items.fixtures.map((kind) => ({ kind })),
      };
    };
    const name = room.name.trim() || `Room ${r + 1}`;
    const treatment =
      r === 0 || !room.finish
        ? defaultTreatment
        : finishOf(room.finish, { treatment: `${at}.finish.treatment`, wainscotHeight: `${at}.finish.wainscotHeight` });
    const common = {
      ceilingHeight: ceilingHeight ?? 0,
      ...(roomLength !== undefined ? { length: roomLength } : {}),
      ...(roomWidth !== undefined ? { width: roomWidth } : {}),
      replaceBaseboard: draft.replaceBaseboard,
      damp: isDamp(room),
    };
    let accentWall: WallView | undefined;
    let accentTreatment: ProjectRoom['treatment'] | undefined;
    if (room.accent) {
      accentWall = covered.find((v) => v.index === room.accent!.wall);
      if (!accentWall) errors[`${at}.accent.wall`] = 'Choose the accent wall (one of the walls to cover).';
      accentTreatment = finishOf(room.accent.finish, { treatment: `${at}.accent.treatment`, wainscotHeight: `${at}.accent.wainscotHeight` });
    }
    const main = covered.filter((v) => v !== accentWall);
    // Split off, the accent wall would break the run of walls the core counts corners along; the
    // main room keeps the corners of the whole room, so the corner trim is the same either way.
    const split = accentWall && accentTreatment ? { insideCorners: defaultInsideCorners(covered.map(toWall)) } : {};
    if (main.length) {
      origin.push({ room: r, accent: false, walls: main.map((v) => v.index) });
      rooms.push({ name, ...common, ...split, walls: main.map(toWall), treatment });
    }
    if (accentWall && accentTreatment) {
      origin.push({ room: r, accent: true, walls: [accentWall.index] });
      rooms.push({
        name: accentRoomName(name),
        ...common,
        insideCorners: main.length ? 0 : split.insideCorners,
        walls: [toWall(accentWall)],
        treatment: accentTreatment,
      });
    }
  });
  if (rooms.length > 20 && !errors['project.rooms']) errors['project.rooms'] = 'At most 20 rooms per estimate (an accent wall counts as a room).';
  if (Object.keys(errors).length) return { project: null, errors, origin };
  // Until the question is answered the live range is priced as "not sure" (lead-safe work
  // included), the cautious reading; sending still waits for an answer (`unansweredQuestions`).
  return {
    project: { rooms, paint: draft.paint, builtBefore1978: draft.builtBefore1978 ?? 'not-sure', measuredBy: draft.measuredBy, photoCount: 0 },
    errors,
    origin,
  };
}

/** The name the accent wall's own room goes by in the estimate, the lead and the e-mails. */
export const ACCENT_SUFFIX = ' — accent wall';
export const accentRoomName = (roomName: string): string => `${roomName.slice(0, 60 - ACCENT_SUFFIX.length)}${ACCENT_SUFFIX}`;

export const BUILT_BEFORE_1978_REQUIRED = 'Choose yes, no or not sure: homes built before 1978 may have lead paint, which changes how the work is done.';

/** Questions the homeowner must answer before going on; they do not stop the live range. */
export function unansweredQuestions(draft: Draft): FieldErrors {
  return draft.builtBefore1978 === null ? { 'project.builtBefore1978': BUILT_BEFORE_1978_REQUIRED } : {};
}

/** Which step shows (and waits for) a field: per-room finishes and accent walls live on the treatment step. */
export function fieldStep(path: string): 'rooms' | 'treatment' | 'options' | null {
  if (path === 'project.treatment' || path === 'project.wainscotHeight' || /^project\.rooms\.\d+\.(finish|accent)\./.test(path)) return 'treatment';
  if (path.startsWith('project.rooms')) return 'rooms';
  if (path === 'project.builtBefore1978') return 'options';
  return null;
}

/**
 * Turns the server's paths into the draft's: project room K is draft room `origin[K].room` (or its
 * accent wall), project wall W of it is draft wall `origin[K].walls[W]`; a room's treatment errors
 * go to that room's finish (the first finish when the room uses it). Without `origin` (or for paths
 * outside it), project rooms are taken to be draft rooms one for one.
 */
export function normaliseServerErrors(fields: FieldErrors, origin?: ProjectOrigin, draft?: Draft): FieldErrors {
  const out: FieldErrors = {};
  for (const [path, message] of Object.entries(fields)) {
    const m = /^project\.rooms\.(\d+)(?:\.(.*))?$/.exec(path);
    let key = path;
    if (m) {
      const k = Number(m[1]);
      const from = origin?.[k] ?? { room: k, accent: false, walls: [] as number[] };
      const rest = m[2] ?? '';
      const at = `project.rooms.${from.room}`;
      const ownFinish = from.room > 0 && draft?.rooms[from.room]?.finish != null;
      const treatment = /^treatment(\.id)?$/.test(rest);
      const wainscot = rest === 'treatment.wainscotHeight';
      const wall = /^walls\.(\d+)(.*)$/.exec(rest);
      if (treatment || wainscot) {
        const field = treatment ? 'treatment' : 'wainscotHeight';
        key = from.accent ? `${at}.accent.${field}` : ownFinish ? `${at}.finish.${field}` : `project.${field}`;
      } else if (wall) key = `${at}.walls.${from.walls[Number(wall[1])] ?? Number(wall[1])}${wall[2]}`;
      else key = rest ? `${at}.${rest}` : at;
    }
    out[key] ??= message;
  }
  return out;
}

/**
 * The rooms and walls as the homeowner sees them, for waiting-for.ts to name what the live range
 * waits for ("the door on Short wall 1 (Bathroom)").
 */
export function draftWaitingContext(draft: Draft, units: Units): WaitingContext {
  return {
    rooms: draft.rooms.map((room) => ({
      name: room.name,
      walls: roomWalls(room, units).map((view) => ({
        label: view.name,
        openings: [
          { kind: 'door', count: room.placement === 'auto' ? room.counts.doors : view.wall.doors },
          { kind: 'window', count: room.placement === 'auto' ? room.counts.windows : view.wall.windows },
        ].filter((o) => o.count > 0),
        fixtures: (room.placement === 'auto' ? room.counts.fixtures : view.wall.fixtures).map((kind) => ({ kind })),
      })),
    })),
  };
}
