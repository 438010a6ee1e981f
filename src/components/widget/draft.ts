/**
 * The widget's form state ("draft") and its translation into the estimating core's project input.
 * Lengths stay as the homeowner typed them (tape style) until they are parsed here.
 */
import type { ProjectInput } from '~/lib/estimate/schemas.ts';
import { parseLength, type Units } from '~/lib/estimate/units.ts';

export type SizeMode = 'room' | 'walls';

export type RoomDraft = {
  key: string;
  name: string;
  mode: SizeMode;
  length: string;
  width: string;
  /** Which of the four walls to cover, clockwise from the first long wall. */
  coverWalls: [boolean, boolean, boolean, boolean];
  walls: { key: string; length: string }[];
  ceilingHeight: string;
  doors: number;
  windows: number;
  outlets: number;
  switches: number;
  damp: boolean;
};

export type Draft = {
  rooms: RoomDraft[];
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
export const newKey = (): string => `k${++counter}`;

export function newRoom(units: Units, name = 'Living room'): RoomDraft {
  const imperial = units === 'imperial';
  return {
    key: newKey(),
    name,
    mode: 'room',
    length: imperial ? "14'" : '4300 mm',
    width: imperial ? "12'" : '3650 mm',
    coverWalls: [true, true, true, true],
    walls: [{ key: newKey(), length: imperial ? "12'" : '3650 mm' }],
    ceilingHeight: imperial ? "8'" : '2440 mm',
    doors: 1,
    windows: 1,
    outlets: 2,
    switches: 1,
    damp: false,
  };
}

export function newDraft(units: Units): Draft {
  return {
    rooms: [newRoom(units)],
    treatmentId: null,
    height: 'wainscot',
    wainscotHeight: units === 'imperial' ? '36"' : '900 mm',
    replaceBaseboard: false,
    paint: true,
    builtBefore1978: null,
    measuredBy: 'homeowner-estimate',
  };
}

/** Field path (as the API names it) → message. */
export type FieldErrors = Record<string, string>;

/** Spreads `total` items over `slots` walls as evenly as possible, first walls first. */
export function spread(total: number, slots: number): number[] {
  return Array.from({ length: slots }, (_, i) => Math.floor(total / slots) + (i < total % slots ? 1 : 0));
}

/**
 * Builds the project input for the API. Lengths that do not parse are reported under the same
 * paths the server would use (`project.rooms.0.length`), so one error display serves both.
 */
export function toProject(draft: Draft, units: Units): { project: ProjectInput | null; errors: FieldErrors } {
  const errors: FieldErrors = {};
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
  if (!draft.treatmentId) errors['project.treatment'] = 'Choose a treatment.';
  const wainscotHeight = draft.height === 'wainscot' ? length('project.wainscotHeight', draft.wainscotHeight, 'Wainscot height') : undefined;

  const rooms = draft.rooms.map((room, r) => {
    const at = `project.rooms.${r}`;
    const ceilingHeight = length(`${at}.ceilingHeight`, room.ceilingHeight, 'Ceiling height');
    let walls: NonNullable<ProjectInput['rooms'][number]['walls']>;
    let roomLength: number | undefined;
    let roomWidth: number | undefined;
    if (room.mode === 'room') {
      roomLength = length(`${at}.length`, room.length, 'Room length');
      roomWidth = length(`${at}.width`, room.width, 'Room width');
      const sides = (['length', 'width', 'length', 'width'] as const).filter((_, i) => room.coverWalls[i]);
      if (sides.length === 0) errors[`${at}.walls`] = 'Choose at least one wall to cover.';
      walls = sides.map((side) => ({ side }));
    } else {
      walls = room.walls.map((wall, w) => ({ length: length(`${at}.walls.${w}.length`, wall.length, 'Wall length') }));
    }
    const n = Math.max(1, walls.length);
    const doors = spread(room.doors, n);
    const windows = spread(room.windows, n);
    const outlets = spread(room.outlets, n);
    const switches = spread(room.switches, n);
    walls = walls.map((wall, i) => ({
      ...wall,
      openings: [...(doors[i] ? [{ kind: 'door' as const, count: doors[i] }] : []), ...(windows[i] ? [{ kind: 'window' as const, count: windows[i] }] : [])],
      outlets: outlets[i],
      switches: switches[i],
    }));
    return {
      name: room.name.trim() || `Room ${r + 1}`,
      ceilingHeight: ceilingHeight ?? 0,
      ...(roomLength !== undefined ? { length: roomLength } : {}),
      ...(roomWidth !== undefined ? { width: roomWidth } : {}),
      walls,
      treatment: { id: draft.treatmentId ?? '', height: draft.height, ...(wainscotHeight !== undefined ? { wainscotHeight } : {}) },
      replaceBaseboard: draft.replaceBaseboard,
      damp: room.damp,
    };
  });
  if (Object.keys(errors).length) return { project: null, errors };
  // Until the question is answered the live range is priced as "not sure" (lead-safe work
  // included), the cautious reading; sending still waits for an answer (`unansweredQuestions`).
  return {
    project: { rooms, paint: draft.paint, builtBefore1978: draft.builtBefore1978 ?? 'not-sure', measuredBy: draft.measuredBy, photoCount: 0 },
    errors,
  };
}

export const BUILT_BEFORE_1978_REQUIRED = 'Choose yes, no or not sure: homes built before 1978 may have lead paint, which changes how the work is done.';

/** Questions the homeowner must answer before going on; they do not stop the live range. */
export function unansweredQuestions(draft: Draft): FieldErrors {
  return draft.builtBefore1978 === null ? { 'project.builtBefore1978': BUILT_BEFORE_1978_REQUIRED } : {};
}

/** Server paths for the treatment's wainscot height live on every room; show them once. */
export function normaliseServerErrors(fields: FieldErrors): FieldErrors {
  const out: FieldErrors = {};
  for (const [path, message] of Object.entries(fields)) {
    const wainscot = /^project\.rooms\.\d+\.treatment\.wainscotHeight$/.test(path);
    const treatment = /^project\.rooms\.\d+\.treatment(\.id)?$/.test(path);
    const key = wainscot ? 'project.wainscotHeight' : treatment ? 'project.treatment' : path;
    out[key] ??= message;
  }
  return out;
}
