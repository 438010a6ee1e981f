/**
 * When a first contact with a new inquiry is due: the firm's response target counted in working
 * time (working days and hours in the firm's own time zone) from the moment the inquiry arrived.
 * An inquiry that arrives on a Friday evening is due on Monday morning, not over the weekend.
 * Pure: no clock, no database.
 */
import { TZDate } from '@date-fns/tz';

export type WorkingTime = {
  /** Days of the week worked, 0 = Sunday … 6 = Saturday (as `Date#getDay`). */
  days: readonly number[];
  /** Start and end of the working day, minutes after local midnight. */
  startMinute: number;
  endMinute: number;
};

/** Monday to Friday, 08:00–17:00 local: the default until a firm sets its own hours (common practice, no source). */
export const DEFAULT_WORKING_TIME: WorkingTime = { days: [1, 2, 3, 4, 5], startMinute: 8 * 60, endMinute: 17 * 60 };

/** Four working hours: the default response target (the default). */
export const DEFAULT_RESPONSE_TARGET_MINUTES = 4 * 60;

const MINUTE_MS = 60_000;

/** The instant of a wall-clock time on the local day of `day` in `timeZone` (DST-safe: the zone's rules decide the offset). */
function atLocalMinute(day: TZDate, minute: number, timeZone: string): TZDate {
  return new TZDate(day.getFullYear(), day.getMonth(), day.getDate(), Math.floor(minute / 60), minute % 60, 0, 0, timeZone);
}

function nextLocalDay(day: TZDate, timeZone: string): TZDate {
  // Noon avoids a day that starts or ends inside a DST change.
  return new TZDate(day.getFullYear(), day.getMonth(), day.getDate() + 1, 12, 0, 0, 0, timeZone);
}

/**
 * `receivedAt` plus `targetMinutes` of working time in `timeZone`. Time outside working hours does
 * not count; a target longer than a working day carries over to the next working day.
 */
export function responseDueAt(
  receivedAt: Date,
  timeZone: string,
  targetMinutes: number = DEFAULT_RESPONSE_TARGET_MINUTES,
  working: WorkingTime = DEFAULT_WORKING_TIME,
): Date {
  if (working.days.length === 0 || working.endMinute <= working.startMinute) throw new RangeError('Working time has no hours.');
  let remainingMs = Math.max(0, targetMinutes) * MINUTE_MS;
  let cursor = new TZDate(receivedAt.getTime(), timeZone);
  // At most a week of skipping plus the working days the target spans.
  for (let guard = 0; guard < 8 + Math.ceil(targetMinutes / (working.endMinute - working.startMinute)) * 7; guard++) {
    const dayStart = atLocalMinute(cursor, working.startMinute, timeZone);
    const dayEnd = atLocalMinute(cursor, working.endMinute, timeZone);
    if (!working.days.includes(cursor.getDay()) || cursor.getTime() >= dayEnd.getTime()) {
      cursor = atLocalMinute(nextLocalDay(cursor, timeZone), working.startMinute, timeZone);
      continue;
    }
    const from = Math.max(cursor.getTime(), dayStart.getTime());
    const available = dayEnd.getTime() - from;
    if (remainingMs <= available) return new Date(from + remainingMs);
    remainingMs -= available;
    cursor = atLocalMinute(nextLocalDay(cursor, timeZone), working.startMinute, timeZone);
  }
  throw new RangeError('Response target could not be placed in working time.');
}

/**
 * How much working time in `timeZone` lies between two moments, in minutes: the inverse of
 * `responseDueAt`, so a first contact made exactly at the due time took the target. Zero when
 * `to` is not after `from`. Used by the owner's report of response times.
 */
export function workingMinutesBetween(from: Date, to: Date, timeZone: string, working: WorkingTime = DEFAULT_WORKING_TIME): number {
  if (working.days.length === 0 || working.endMinute <= working.startMinute) throw new RangeError('Working time has no hours.');
  const end = to.getTime();
  let totalMs = 0;
  let cursor = new TZDate(from.getTime(), timeZone);
  // One pass per local day; an answer years late still ends (about 370 passes a year).
  while (cursor.getTime() < end) {
    if (working.days.includes(cursor.getDay())) {
      const start = Math.max(cursor.getTime(), atLocalMinute(cursor, working.startMinute, timeZone).getTime());
      const stop = Math.min(end, atLocalMinute(cursor, working.endMinute, timeZone).getTime());
      if (stop > start) totalMs += stop - start;
    }
    cursor = atLocalMinute(nextLocalDay(cursor, timeZone), 0, timeZone);
  }
  return totalMs / MINUTE_MS;
}
