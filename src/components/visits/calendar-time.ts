/**
 * The Visits calendar's arithmetic on the firm's clock: which local dates a week holds, where a
 * visit sits in its day column, the instant a dropped block stands for, the open hours to shade,
 * and side-by-side lanes for visits that overlap. Pure; zone work only through @date-fns/tz (by
 * way of the visit core's wall-clock helpers).
 */
import { format } from 'date-fns';
import { tz } from '@date-fns/tz';
import { firstInstantAtWallClock, wallClockAt } from '~/lib/visits/local-time';
import { zoneOrUtc } from '~/lib/shared/time';
import { WEEKDAYS, type HoursRange, type Weekday, type WeeklyHours } from '~/lib/shared/visit-schemas';

/** A calendar date on the firm's clock, `YYYY-MM-DD`. */
export type LocalDate = string;

const DAY_MS = 24 * 60 * 60 * 1000;

function parts(date: LocalDate): [number, number, number] {
  const [year, month, day] = date.split('-').map(Number) as [number, number, number];
  return [year, month, day];
}

/** Plain calendar arithmetic on a date (no zone is involved in counting days). */
export function addDays(date: LocalDate, days: number): LocalDate {
  const [year, month, day] = parts(date);
  return new Date(Date.UTC(year, month - 1, day) + days * DAY_MS).toISOString().slice(0, 10);
}

export function weekdayOf(date: LocalDate): Weekday {
  const [year, month, day] = parts(date);
  // getUTCDay: 0 = Sunday. WEEKDAYS starts on Monday.
  return WEEKDAYS[(new Date(Date.UTC(year, month - 1, day)).getUTCDay() + 6) % 7]!;
}

/** The Monday of the week holding `date` (weeks run Monday to Sunday). */
export function mondayOf(date: LocalDate): LocalDate {
  return addDays(date, -WEEKDAYS.indexOf(weekdayOf(date)));
}

export function weekDates(monday: LocalDate): LocalDate[] {
  return WEEKDAYS.map((_, i) => addDays(monday, i));
}

/** The firm's local date at an instant. */
export function localDateAt(at: Date, timeZone: string): LocalDate {
  return format(at, 'yyyy-MM-dd', { in: tz(zoneOrUtc(timeZone)) });
}

/** Minutes since local midnight that the firm's clock shows at `at` (its wall-clock time of day). */
export function wallMinutesAt(at: Date, timeZone: string): number {
  const wall = wallClockAt(at, zoneOrUtc(timeZone));
  return wall.hour * 60 + wall.minute;
}

/**
 * The instant the firm's clock shows `minutes` after midnight on `date`, or null when the clock
 * skips that time (the hour lost when summer time starts). A repeated time is its first showing.
 */
export function instantAt(date: LocalDate, minutes: number, timeZone: string): Date | null {
  const [year, month, day] = parts(date);
  return firstInstantAtWallClock({ year, month, day, hour: Math.floor(minutes / 60), minute: minutes % 60 }, zoneOrUtc(timeZone));
}

/** When a local date begins: its midnight, or the first minute it has when midnight is skipped. */
export function startOfLocalDate(date: LocalDate, timeZone: string): Date {
  for (let minutes = 0; minutes < 24 * 60; minutes += 15) {
    const at = instantAt(date, minutes, timeZone);
    if (at) return at;
  }
  throw new RangeError(`No time on ${date} in ${timeZone}`);
}

/** The instants the calendar asks for: from the first date's start to the start of the date after the last. */
export function rangeOfDates(first: LocalDate, count: number, timeZone: string): { from: Date; to: Date } {
  return { from: startOfLocalDate(first, timeZone), to: startOfLocalDate(addDays(first, count), timeZone) };
}

/** `minutes` rounded to the nearest multiple of `step` (the firm's slot step). */
export function snapToStep(minutes: number, step: number): number {
  return Math.round(minutes / step) * step;
}

const minutesOf = (hhmm: string) => Number(hhmm.slice(0, 2)) * 60 + Number(hhmm.slice(3, 5));

export type PersonHours = { membershipId: string; weekly: WeeklyHours; daysOff: string[] };

/**
 * The open hours on a date, as minute ranges after midnight, merged: the weekly ranges of that
 * weekday of everyone given, except those who have the date off.
 */
export function openMinutesOn(date: LocalDate, people: PersonHours[]): { from: number; to: number }[] {
  const day = weekdayOf(date);
  const ranges = people
    .filter((p) => !p.daysOff.includes(date))
    .flatMap((p) => (p.weekly[day] ?? []).map((r: HoursRange) => ({ from: minutesOf(r.from), to: minutesOf(r.to) })))
    .sort((a, b) => a.from - b.from);
  const merged: { from: number; to: number }[] = [];
  for (const range of ranges) {
    const last = merged[merged.length - 1];
    if (last && range.from <= last.to) last.to = Math.max(last.to, range.to);
    else merged.push({ ...range });
  }
  return merged;
}

/**
 * Side-by-side lanes for a day's visits: visits that overlap in time (directly or through a chain
 * of others) share a group, each gets the first lane free at its start, and `lanes` is how many
 * the group needed (each block is then 1/lanes wide).
 */
export function layoutLanes<T extends { start: number; end: number }>(items: T[]): (T & { lane: number; lanes: number })[] {
  const sorted = [...items].sort((a, b) => a.start - b.start || a.end - b.end);
  const placed: (T & { lane: number; lanes: number })[] = [];
  let group: (T & { lane: number; lanes: number })[] = [];
  let groupEnd = -Infinity;
  const closeGroup = () => {
    const lanes = Math.max(1, ...group.map((g) => g.lane + 1));
    for (const item of group) item.lanes = lanes;
    group = [];
  };
  for (const item of sorted) {
    if (item.start >= groupEnd) {
      closeGroup();
      groupEnd = -Infinity;
    }
    const laneEnds: number[] = [];
    for (const other of group) laneEnds[other.lane] = Math.max(laneEnds[other.lane] ?? -Infinity, other.end);
    let lane = 0;
    while (laneEnds[lane] !== undefined && laneEnds[lane]! > item.start) lane++;
    const entry = { ...item, lane, lanes: 1 };
    group.push(entry);
    placed.push(entry);
    groupEnd = Math.max(groupEnd, item.end);
  }
  closeGroup();
  return placed;
}

/** `Tue 9:00 AM` on the firm's clock: how the calendar names a visit's time in its questions. */
export function shortDayTime(at: Date | string, timeZone: string): string {
  return format(new Date(at), 'EEE h:mm a', { in: tz(zoneOrUtc(timeZone)) });
}

/** `9:00 AM` on the firm's clock. */
export function clockTime(at: Date | string, timeZone: string): string {
  return format(new Date(at), 'h:mm a', { in: tz(zoneOrUtc(timeZone)) });
}

/** `Tue, Dec 8` for a local date (a day column's or a day list's heading). */
export function dateHeading(date: LocalDate): string {
  const [year, month, day] = parts(date);
  return format(new Date(Date.UTC(year, month - 1, day, 12)), 'EEE, MMM d', { in: tz('UTC') });
}

/** A person's initials for a small block: `Sam Hollis` → `SH`. */
export function initials(name: string): string {
  const words = name.trim().split(/\s+/).filter(Boolean);
  return (words.length > 1 ? words[0]![0]! + words[words.length - 1]![0]! : (words[0] ?? '?').slice(0, 2)).toUpperCase();
}

/** `9 AM`, `12 PM`: an hour mark down the side of the week (a time of day, no date or zone). */
export function hourLabel(minutes: number): string {
  return format(new Date(Date.UTC(2000, 0, 1, Math.floor(minutes / 60), minutes % 60)), minutes % 60 ? 'h:mm a' : 'h a', { in: tz('UTC') });
}
