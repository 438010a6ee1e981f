/** Who must disconnect and reconnect the fixtures a job works around. */
import type { Caution, RoomTakeoff } from './types.ts';

const PLUMBED = new Set(['tub', 'shower', 'vanity', 'toilet', 'radiator']);

export function fixtureCautions(rooms: RoomTakeoff[]): Caution[] {
  const kinds = (r: RoomTakeoff): string[] => r.walls.flatMap((w) => (w.fixtures ?? []).map((f) => f.kind));
  const withPlumbing = rooms.filter((r) => kinds(r).some((k) => PLUMBED.has(k)));
  const withBuiltIns = rooms.filter((r) => kinds(r).includes('built-in'));
  if (withPlumbing.length === 0 && withBuiltIns.length === 0) return [];
  const text =
    (withPlumbing.length > 0
      ? 'Where a toilet, vanity, tub, shower or radiator has to be disconnected, the water, drain or heating connections are shut off, ' +
        'disconnected and reconnected by a licensed plumber wherever local codes require it, and checked for leaks before the room is used. '
      : '') +
    (withBuiltIns.length > 0
      ? 'Lights or outlets in a built-in cabinet are disconnected and reconnected by a licensed electrician with the power off at the panel. '
      : '') +
    'Your local codes and inspector have the final word.';
  return [
    {
      id: 'fixture-trades',
      title: 'Plumbing and wiring at fixtures',
      text,
      rooms: [...new Set([...withPlumbing, ...withBuiltIns].map((r) => r.name))],
    },
  ];
}
