/**
 * The times a firm can offer for a visit: its weekly hours on its own clock, less days off, busy
 * time (with a buffer either side), the minimum notice and the horizon. Pure: the caller passes
 * `now` and the busy ranges.
 */
import { addMinutes } from 'date-fns';
import { localDay, wallClockAt, type CalendarDate, type WallClock } from './local-time.ts';
import { checkSlotInput, minutesOfDay, WEEKDAYS, type Weekday } from './slot-input.ts';

export { SlotInputError } from './slot-input.ts';

export type TimeRange = { start: Date; end: Date };

export type OpenSlotsInput = {
  /** IANA name, e.g. `America/New_York`. */
  timeZone: string;
  /** Wall-clock ranges (`HH:MM`) per weekday; a missing day has none. */
  weekly: Partial<Record<Weekday, { from: string; to: string }[]>>;
  /** Local dates (`YYYY-MM-DD`) with no visits. */
  daysOff?: string[];
  visitMinutes: number;
  /** Kept free before and after every busy range. */
  bufferMinutes: number;
  /** Starts are `from`, `from + step`, … on the wall clock within each range. */
  stepMinutes: number;
  /** No slot starts before `now` plus this. */
  minNoticeMinutes: number;
  /** No slot on a local date later than today plus this many days (today is `now`'s local date). */
  horizonDays: number;
  busy: TimeRange[];
  now: Date;
};

/**
 * The open slots, sorted by start. Each starts on its range's wall-clock grid (`from`, `from +
 * step`, …), lasts `visitMinutes` of real time, and ends on the same local date no later than the
 * range's `to` on the wall clock. A start the zone's clock skips that day (spring forward) is left
 * out; a start it shows twice (fall back) is the first time it shows. Intervals are half-open: a
 * slot may touch a busy range widened by the buffer, and may start exactly at `now + minNotice`.
 *
 * @throws SlotInputError (with the field path) for input it cannot use.
 */
export function openSlots(input: OpenSlotsInput): TimeRange[] {
  const { timeZone, weekly, daysOff = [], visitMinutes, bufferMinutes, stepMinutes, minNoticeMinutes, horizonDays, busy, now } = checkSlotInput(input);
  const earliestStart = addMinutes(now, minNoticeMinutes).getTime();
  const isBusy = busyLookup(busy, bufferMinutes);
  const off = new Set(daysOff);
  const today = wallClockAt(now, timeZone);
  const slots: TimeRange[] = [];

  for (let ahead = 0; ahead <= horizonDays; ahead++) {
    const date = calendarDate(today, ahead);
    if (off.has(date.key)) continue;
    const ranges = [...(weekly[date.weekday] ?? [])].map((r) => ({ from: minutesOfDay(r.from), to: minutesOfDay(r.to) })).sort((a, b) => a.from - b.from);
    if (ranges.length === 0) continue;
    const day = localDay(date.wall, timeZone);
    for (const { from, to } of ranges) {
      for (let minute = from; minute < to; minute += stepMinutes) {
        const start = day.firstInstantAt(minute);
        if (!start || start.getTime() < earliestStart) continue;
        const end = addMinutes(start, visitMinutes);
        if (!endsInRange(day.wallClockAt(end), date.wall, to) || isBusy(start.getTime(), end.getTime())) continue;
        slots.push({ start, end });
      }
    }
  }
  return slots.sort((a, b) => a.start.getTime() - b.start.getTime());
}

/** Whether the zone's clock at the end (`seen`) is on the same local date and no later than `to` (minutes after midnight). */
function endsInRange(seen: WallClock, date: CalendarDate, to: number): boolean {
  return seen.year === date.year && seen.month === date.month && seen.day === date.day && seen.hour * 60 + seen.minute <= to;
}

/**
 * The calendar date `ahead` days after `today`'s date, with its weekday and `YYYY-MM-DD` key. Pure
 * calendar arithmetic (a UTC date stands for the calendar date, no zone is involved).
 */
function calendarDate(today: WallClock, ahead: number) {
  const day = new Date(Date.UTC(today.year, today.month - 1, today.day + ahead));
  const wall = { year: day.getUTCFullYear(), month: day.getUTCMonth() + 1, day: day.getUTCDate() };
  return { wall, key: day.toISOString().slice(0, 10), weekday: WEEKDAYS[day.getUTCDay()]! };
}

/**
 * A test for "does [start, end) overlap any busy range widened by the buffer": the widened ranges
 * merged into disjoint, sorted ones, then a binary search.
 */
function busyLookup(busy: TimeRange[], bufferMinutes: number): (start: number, end: number) => boolean {
  const widened = busy
    .map((b) => [addMinutes(b.start, -bufferMinutes).getTime(), addMinutes(b.end, bufferMinutes).getTime()] as const)
    .filter(([from, to]) => to > from)
    .sort((a, b) => a[0] - b[0]);
  const merged: [number, number][] = [];
  for (const [from, to] of widened) {
    const last = merged.at(-1);
    if (last && from <= last[1]) last[1] = Math.max(last[1], to);
    else merged.push([from, to]);
  }
  return (start, end) => {
    // The first merged range that ends after `start`; only it can overlap.
    let low = 0;
    let high = merged.length;
    while (low < high) {
      const mid = (low + high) >> 1;
      if (merged[mid]![1] > start) high = mid;
      else low = mid + 1;
    }
    return low < merged.length && merged[low]![0] < end;
  };
}
