/**
 * How many times the crew comes to the house, and the set-up and clean-up those trips cost.
 * Rules (docs/sources.md §26; common practice, no source):
 * - install days: install, trim and cut-out hours ÷ the rate book's working hours per day, rounded up;
 * - when the firm paints, one visit to caulk and fill once the work is up: filler has to dry and be
 *   sanded and caulk to cure before a coat goes over them, so it is not folded into an install day;
 * - one visit per coat of primer and per coat of paint, because each coat must dry before the next.
 * Set-up and clean-up is charged per visit (not per room, the old rule).
 */
import type { RateBook } from './schemas.ts';
import type { SiteVisits } from './types.ts';

const EPS = 1e-9;

/** Set-up per visit; an older rate book's per-room figure stands in when the per-visit one is missing. */
export function setupHoursPerVisit(labour: RateBook['labour']): number {
  return labour.setupHoursPerVisit ?? labour.setupHoursPerRoom ?? 0;
}

export function siteVisits(work: {
  installHours: number;
  hoursPerDay: number;
  painting: boolean;
  primerCoats: number;
  paintCoats: number;
  setupHoursEach: number;
}): SiteVisits {
  const installDays = work.installHours > EPS ? Math.ceil(work.installHours / work.hoursPerDay - EPS) : 0;
  const caulkAndFill = work.painting && work.primerCoats + work.paintCoats > 0 ? 1 : 0;
  const primerCoats = work.painting ? work.primerCoats : 0;
  const paintCoats = work.painting ? work.paintCoats : 0;
  return {
    total: installDays + caulkAndFill + primerCoats + paintCoats,
    installDays,
    caulkAndFill,
    primerCoats,
    paintCoats,
    setupHoursEach: work.setupHoursEach,
  };
}

/** "5 visits: 2 install days, 1 to caulk and fill, 1 primer coat, 2 paint coats". */
export function describeVisits(v: SiteVisits): string {
  const n = (k: number, one: string, many: string): string => `${k} ${k === 1 ? one : many}`;
  const parts = [
    v.installDays > 0 ? n(v.installDays, 'install day', 'install days') : '',
    v.caulkAndFill > 0 ? `${v.caulkAndFill} to caulk and fill` : '',
    v.primerCoats > 0 ? n(v.primerCoats, 'primer coat', 'primer coats') : '',
    v.paintCoats > 0 ? n(v.paintCoats, 'paint coat', 'paint coats') : '',
  ].filter(Boolean);
  return `${n(v.total, 'visit', 'visits')}: ${parts.join(', ')}`;
}
