/**
 * What the homeowner chose per room, for the lead page, the e-mails and the homeowner's estimate
 * page: room → finish, height, walls covered, accent wall. The widget sends an accent wall as a room
 * of its own named "<room> — accent wall" (src/components/widget/draft.ts); here it is folded back
 * into its room, so staff and homeowner read one line per room as it was asked.
 */
import { formatLength, type RoomTakeoff, type Units } from '~/lib/estimate';

const ACCENT_SUFFIX = ' — accent wall';

export type RoomFinishChoice = { finish: string; height: string; walls: string[] };
export type RoomChoice = RoomFinishChoice & { name: string; damp: boolean; accent: RoomFinishChoice | null };

function heightText(room: RoomTakeoff, units: Units): string {
  return room.height === 'full' ? 'full height' : `wainscot, ${formatLength(room.bandTop, units)} high`;
}

function finishOf(room: RoomTakeoff, units: Units): RoomFinishChoice {
  return { finish: room.treatmentName, height: heightText(room, units), walls: room.walls.map((w) => w.label) };
}

export function roomChoices(rooms: RoomTakeoff[], units: Units): RoomChoice[] {
  const out: RoomChoice[] = [];
  for (const room of rooms) {
    const owner = room.name.endsWith(ACCENT_SUFFIX) ? out.find((c) => c.name === room.name.slice(0, -ACCENT_SUFFIX.length) && !c.accent) : undefined;
    if (owner) owner.accent = finishOf(room, units);
    else if (room.name.endsWith(ACCENT_SUFFIX)) {
      // An accent wall whose room covers no other wall: the room is just that wall.
      const name = room.name.slice(0, -ACCENT_SUFFIX.length);
      out.push({ name, damp: room.damp, finish: room.treatmentName, height: heightText(room, units), walls: [], accent: finishOf(room, units) });
    } else out.push({ name: room.name, damp: room.damp, ...finishOf(room, units), accent: null });
  }
  return out;
}

/** One line per room: "Living room: Beadboard wainscot, wainscot, 48" high; Long wall 1, Short wall 2; accent wall Short wall 1: Board and batten, full height." */
export function describeRoomChoice(choice: RoomChoice): string {
  const main = choice.walls.length ? `${choice.finish}, ${choice.height} on ${choice.walls.join(', ')}` : '';
  const accent = choice.accent ? `accent wall ${choice.accent.walls.join(', ')}: ${choice.accent.finish}, ${choice.accent.height}` : '';
  return `${choice.name}: ${[main, accent].filter(Boolean).join('; ')}${choice.damp ? ' (damp room)' : ''}`;
}
