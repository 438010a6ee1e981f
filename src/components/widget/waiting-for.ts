/**
 * A short phrase for what the live range is waiting for ("the door on Short wall 1"), taken from
 * the first field error's path, so the homeowner knows which answer to look at instead of a range
 * that silently never appears.
 */
import { FIXTURE_TABLE } from '~/lib/estimate/fixtures.ts';
import type { FixtureKind } from '~/lib/estimate/schemas.ts';
import { listedWallNames, roomWallNames } from '~/lib/shared/wall-names';

/** The little the phrase needs to know about the project; read loosely, so any draft or project shape fits. */
export type WaitingContext = {
  rooms: Array<{
    name?: string;
    length?: number;
    width?: number;
    walls?: Array<{
      label?: string;
      side?: 'length' | 'width';
      length?: number;
      openings?: Array<{ kind: string; count?: number }>;
      fixtures?: Array<{ kind: string }>;
    }>;
  }>;
};

const GENERAL = 'one of your answers';

/** The wall's name as the homeowner saw it: its own label, or its place among the room's sides. */
function wallName(room: WaitingContext['rooms'][number] | undefined, w: number): string {
  const walls = room?.walls ?? [];
  const wall = walls[w];
  if (wall?.label) return wall.label;
  if (wall?.side) {
    const names = roomWallNames(room?.length, room?.width);
    const before = walls.slice(0, w).filter((x) => x.side === wall.side).length;
    const slot = (wall.side === 'length' ? 0 : 1) + 2 * Math.min(before, 1);
    return names[slot]!;
  }
  return listedWallNames(w + 1)[w]!;
}

function plural(word: string, n: number): string {
  return n === 1 ? word : `${word}s`;
}

function openingsPhrase(openings: Array<{ kind: string; count?: number }> | undefined, only?: number): string {
  const list = only === undefined ? (openings ?? []) : openings?.[only] ? [openings[only]] : [];
  const doors = list.filter((o) => o.kind === 'door').reduce((n, o) => n + (o.count ?? 1), 0);
  const windows = list.filter((o) => o.kind === 'window').reduce((n, o) => n + (o.count ?? 1), 0);
  if (doors && windows) return `the ${plural('door', doors)} and ${plural('window', windows)}`;
  if (doors) return `the ${plural('door', doors)}`;
  if (windows) return `the ${plural('window', windows)}`;
  return only === undefined ? 'the doors and windows' : 'the opening';
}

function fixturesPhrase(fixtures: Array<{ kind: string }> | undefined, only?: number): string {
  const list = only === undefined ? (fixtures ?? []) : fixtures?.[only] ? [fixtures[only]] : [];
  const names = [...new Set(list.map((f) => FIXTURE_TABLE[f.kind as FixtureKind]?.name ?? 'fixture'))];
  if (names.length === 0) return 'the fixtures';
  if (names.length === 1) return `the ${names[0]}`;
  return `the ${names.slice(0, -1).join(', ')} and ${names.at(-1)}`;
}

/** The phrase for one field path (`project.rooms.0.walls.1.openings`, with or without `project.`). */
export function waitingForLabel(path: string, context: WaitingContext): string {
  const p = path.replace(/^project\./, '');
  if (p === 'treatment' || /^rooms\.\d+\.treatment(\.id)?$/.test(p)) return 'a choice of treatment';
  if (p === 'wainscotHeight' || /^rooms\.\d+\.treatment\.wainscotHeight$/.test(p)) return 'the wainscot height';
  if (p === 'builtBefore1978') return 'when the home was built';
  if (p === 'rooms') return 'a room';
  if (p === 'formToken') return 'a fresh copy of this page (please reload it)';

  const roomMatch = /^rooms\.(\d+)(?:\.(.*))?$/.exec(p);
  if (!roomMatch) return GENERAL;
  const r = Number(roomMatch[1]);
  const rest = roomMatch[2] ?? '';
  const room = context.rooms[r];
  const roomName = room?.name?.trim() || `Room ${r + 1}`;
  const inRoom = (phrase: string) => (context.rooms.length === 1 ? phrase : `${phrase} (${roomName})`);

  const simple: Record<string, string> = {
    name: "the room's name",
    length: 'the room length',
    width: 'the room width',
    ceilingHeight: 'the ceiling height',
    walls: 'a wall to cover',
    damp: 'whether the room gets damp',
    placement: 'a wall for each door and window',
    finish: "the room's finish",
    'finish.treatmentId': "the room's finish",
    'finish.wainscotHeight': 'the wainscot height',
    accent: 'the accent wall',
    'accent.wall': 'the accent wall',
  };
  if (rest in simple) return inRoom(simple[rest]!);

  const wallMatch = /^walls\.(\d+)(?:\.([a-zA-Z]+)(?:\.(\d+))?)?/.exec(rest);
  if (!wallMatch) return inRoom(GENERAL);
  const w = Number(wallMatch[1]);
  const wall = room?.walls?.[w];
  const name = wallName(room, w);
  const field = wallMatch[2];
  const index = wallMatch[3] === undefined ? undefined : Number(wallMatch[3]);
  if (field === 'openings') return inRoom(`${openingsPhrase(wall?.openings, index)} on ${name}`);
  if (field === 'fixtures') return inRoom(`${fixturesPhrase(wall?.fixtures, index)} on ${name}`);
  if (field === 'outlets') return inRoom(`the outlets on ${name}`);
  if (field === 'switches') return inRoom(`the switches on ${name}`);
  if (field === 'length') return inRoom(`the length of ${name}`);
  return inRoom(name);
}

/** Steps' order: rooms first (by number), then the treatment, then the rest. */
function stepOrder(path: string): number {
  const p = path.replace(/^project\./, '');
  if (p.startsWith('rooms')) return 0;
  if (p === 'treatment' || p === 'wainscotHeight') return 1;
  return 2;
}

/** The phrase for the first problem, in the order the homeowner meets the steps; null when there is none. */
export function waitingFor(errors: Record<string, string>, context: WaitingContext): string | null {
  const paths = Object.keys(errors).sort((a, b) => stepOrder(a) - stepOrder(b) || a.localeCompare(b, 'en', { numeric: true }));
  return paths.length ? waitingForLabel(paths[0]!, context) : null;
}
