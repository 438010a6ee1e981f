/** Labour a stair wall adds: the skirt board along the rake and every end cut to the stair's angle (docs/sources.md §43). */
import type { RateBook } from './schemas.ts';
import type { LabourLine, Takeoff } from './types.ts';

const r2 = (x: number): number => Math.round(x * 100) / 100;

export function stairLabour(takeoff: Takeoff, labour: RateBook['labour']): LabourLine[] {
  const skirtFeet = takeoff.rooms.reduce((s, r) => s + (r.skirtFeet ?? 0), 0);
  const rakeCuts = takeoff.rooms.reduce((s, r) => s + (r.rakeCuts ?? 0), 0);
  const lines: LabourLine[] = [];
  // A skirt board goes on like a baseboard, at the baseboard's rate per foot (common practice, no source).
  if (skirtFeet > 0 && labour.hoursPerFootBaseboardInstalled > 0)
    lines.push({
      task: 'skirt-board',
      label: 'Install skirt board along the stair',
      hours: skirtFeet * labour.hoursPerFootBaseboardInstalled,
      basis: `${r2(skirtFeet)} ft × ${labour.hoursPerFootBaseboardInstalled} h per ft`,
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
