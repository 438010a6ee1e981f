/** Labour for fixtures: remove and reset the ones the treatment goes behind, scribe to the ones it stops at. */
import { DEFAULT_HOURS_PER_FIXTURE, FIXTURE_TABLE } from './fixtures.ts';
import type { FixtureKind } from './schemas.ts';
import type { LabourLine, PlacedFixture, Takeoff } from './types.ts';

export function fixtureLabour(takeoff: Takeoff, hoursPerFixture: Partial<Record<FixtureKind, number | undefined>> = {}): LabourLine[] {
  const all: PlacedFixture[] = takeoff.rooms.flatMap((r) => r.walls.flatMap((w) => w.fixtures ?? []));
  const lines: LabourLine[] = [];
  const line = (placement: 'behind' | 'stops', task: LabourLine['task'], label: string): void => {
    const counts = new Map<FixtureKind, number>();
    for (const f of all) if (f.placement === placement) counts.set(f.kind, (counts.get(f.kind) ?? 0) + 1);
    let hours = 0;
    const parts: string[] = [];
    for (const [kind, n] of counts) {
      const each = hoursPerFixture[kind] ?? DEFAULT_HOURS_PER_FIXTURE[kind];
      if (each <= 0) continue;
      hours += n * each;
      parts.push(`${n} ${FIXTURE_TABLE[kind].name}${n === 1 ? '' : 's'} × ${each} h each`);
    }
    if (hours > 0) lines.push({ task, label, hours, basis: parts.join(' + ') });
  };
  line('behind', 'fixture-reset', 'Remove and reset fixtures');
  line('stops', 'fixture-scribe', 'Scribe the treatment to fixtures');
  return lines;
}
