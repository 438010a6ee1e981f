/** Labour a stair wall adds: the skirt board along the rake and every end cut to the stair's angle (docs/sources.md §43). */
import type { RateBook } from './schemas.ts';
import type { LabourLine, Takeoff } from './types.ts';

const r2 = (x: number): number => Math.round(x * 100) / 100;

export function stairLabour(takeoff: Takeoff, labour: RateBook['labour']): LabourLine[] {
  const skirtFeet = takeoff.rooms.reduce((s, r) => s + (r.skirtFeet ?? 0), 0);
  const rakeCuts = takeoff.rooms.reduce((s, r) => s + (r.rakeCuts ?? 0), 0);
  const lines: LabourLine[] = [];
  // The old skirt board along the stair comes off and the new one goes on, at the baseboard's rates per
  // foot (common practice, no source). Counting the removal keeps a longer stair from costing less than
  // the level baseboard it replaces.
  const perFoot = labour.hoursPerFootBaseboardRemoved + labour.hoursPerFootBaseboardInstalled;
  if (skirtFeet > 0 && perFoot > 0)
    lines.push({
      task: 'skirt-board',
      label: 'Replace the skirt board along the stair',
      hours: skirtFeet * perFoot,
      basis: `${r2(skirtFeet)} ft × (${labour.hoursPerFootBaseboardRemoved} h to remove + ${labour.hoursPerFootBaseboardInstalled} h to install) per ft`,
    });
  if (rakeCuts > 0 && labour.hoursPerRakeCut > 0)
    lines.push({
      task: 'rake-cuts',
      label: "Cuts to the stair's angle",
      hours: rakeCuts * labour.hoursPerRakeCut,
      basis: `${rakeCuts} rake cuts × ${labour.hoursPerRakeCut} h each`,
    });
  return lines;
}
