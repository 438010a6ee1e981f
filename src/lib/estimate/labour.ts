/** Labour hours by task: productivity per treatment and time per item, from the rate book. */
import type { RateBook } from './schemas.ts';
import { fixtureLabour } from './fixture-labour.ts';
import { stairLabour } from './stair-labour.ts';
import { paintingLabour } from './painting.ts';
import { describeVisits, setupHoursPerVisit, siteVisits } from './site-visits.ts';
import type { LabourLine, SiteVisits, Takeoff } from './types.ts';
import { formatArea } from './units.ts';

const r2 = (x: number): number => Math.round(x * 100) / 100;

export function labourFor(takeoff: Takeoff, rateBook: RateBook): LabourLine[] {
  return labourAndVisits(takeoff, rateBook).lines;
}

/** Labour lines and the site visits the set-up line was counted from. */
export function labourAndVisits(takeoff: Takeoff, rateBook: RateBook): { lines: LabourLine[]; visits: SiteVisits } {
  const L = rateBook.labour;
  const units = takeoff.units;
  const lines: LabourLine[] = [];
  const sum = (f: (r: Takeoff['rooms'][number]) => number): number => takeoff.rooms.reduce((s, r) => s + f(r), 0);

  // Install, grouped by treatment so each productivity rate shows once.
  const byTreatment = new Map<string, number>();
  for (const r of takeoff.rooms) byTreatment.set(r.treatmentId, (byTreatment.get(r.treatmentId) ?? 0) + r.netSqFt);
  for (const [id, sqFt] of byTreatment) {
    const t = rateBook.catalogue.treatments.find((x) => x.id === id);
    if (!t || sqFt <= 0) continue;
    lines.push({
      task: 'install',
      label: `Install ${t.name.toLowerCase()}`,
      hours: sqFt / t.sqFtPerHour,
      basis: `${formatArea(sqFt, units)} ÷ ${t.sqFtPerHour} sq ft per hour`,
    });
  }
  const perItem = (task: LabourLine['task'], label: string, n: number, each: number, what: string): void => {
    if (n > 0 && each > 0) lines.push({ task, label, hours: n * each, basis: `${r2(n)} ${what} × ${each} h each` });
  };
  perItem(
    'cut-outs',
    'Cut-outs for outlets and switches',
    sum((r) => r.cutOuts),
    L.hoursPerCutOut,
    'cut-outs',
  );
  perItem(
    'returns',
    'Returns at windows and doors',
    sum((r) => r.returns),
    L.hoursPerReturn,
    'returns',
  );
  perItem(
    'corners',
    'Inside and outside corners',
    sum((r) => r.insideCorners + r.outsideCorners),
    L.hoursPerCorner,
    'corners',
  );
  const perFoot = (task: LabourLine['task'], label: string, feet: number, each: number): void => {
    if (feet > 0 && each > 0) lines.push({ task, label, hours: feet * each, basis: `${r2(feet)} ft × ${each} h per ft` });
  };
  perFoot(
    'baseboard-removal',
    'Remove old baseboard',
    sum((r) => r.baseboardRemovedFeet),
    L.hoursPerFootBaseboardRemoved,
  );
  perFoot(
    'baseboard',
    'Install new baseboard',
    sum((r) => r.baseboardRemovedFeet),
    L.hoursPerFootBaseboardInstalled,
  );
  perFoot(
    'cap-rail',
    'Install cap rail',
    sum((r) => r.capRailFeet),
    L.hoursPerFootCapRail,
  );
  perFoot(
    'back-band',
    'Install back band at casings',
    sum((r) => r.backBandFeet ?? 0),
    L.hoursPerFootBackBand,
  );
  lines.push(...stairLabour(takeoff, L));
  perItem(
    'stool-refit',
    'Refit window stools and aprons',
    sum((r) => r.stoolRefits ?? 0),
    L.hoursPerStoolRefit,
    'windows',
  );
  lines.push(...fixtureLabour(takeoff, L.hoursPerFixture));
  // Install days count every hour so far (install, trim, cut-outs); painting comes on its own visits.
  const installHours = lines.reduce((a, l) => a + l.hours, 0);
  const painting = paintingLabour(takeoff, rateBook);
  lines.push(...painting.lines);
  const visits = siteVisits({
    installHours,
    hoursPerDay: L.hoursPerDay,
    painting: takeoff.facts.paint,
    primerCoats: painting.primerCoats,
    paintCoats: painting.paintCoats,
    setupHoursEach: setupHoursPerVisit(L),
  });
  if (visits.total > 0 && visits.setupHoursEach > 0) {
    lines.push({
      task: 'setup',
      label: 'Set-up and clean-up',
      hours: visits.total * visits.setupHoursEach,
      basis: `${visits.total} ${visits.total === 1 ? 'visit' : 'visits'} × ${visits.setupHoursEach} h (${describeVisits(visits)})`,
    });
  }
  return { lines, visits };
}
