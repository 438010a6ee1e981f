/**
 * When a visit's reminder goes out: 09:00 on the firm's clock on the local day before the visit,
 * or at once when that moment has already passed at booking. Pure.
 */
import { TZDate } from '@date-fns/tz';
import { firstInstantAtWallClock, isKnownTimeZone, wallClockAt } from './local-time.ts';

/** The reminder's time of day on the firm's clock (a product choice, no source). */
export const REMINDER_LOCAL_TIME = { hour: 9, minute: 0 } as const;

/**
 * 09:00 in `timeZone` on the local date before `visitStart`'s local date; `bookedAt` itself when
 * that moment is not after `bookedAt` (booked less than a day ahead, or after that 09:00).
 *
 * @throws RangeError for an unknown zone or an invalid date.
 */
export function reminderDueAt(visitStart: Date, timeZone: string, bookedAt: Date): Date {
  if (!isKnownTimeZone(timeZone)) throw new RangeError(`Not a time zone this runtime knows: ${timeZone}`);
  for (const [name, date] of [
    ['visitStart', visitStart],
    ['bookedAt', bookedAt],
  ] as const) {
    if (!(date instanceof Date) || !Number.isFinite(date.getTime())) throw new RangeError(`${name} is not a valid date`);
  }
  const visitDay = wallClockAt(visitStart, timeZone);
  // The calendar date before (a UTC date stands for it; no zone is involved in counting days).
  const dayBefore = new Date(Date.UTC(visitDay.year, visitDay.month - 1, visitDay.day - 1));
  const wall = { year: dayBefore.getUTCFullYear(), month: dayBefore.getUTCMonth() + 1, day: dayBefore.getUTCDate(), ...REMINDER_LOCAL_TIME };
  // A 09:00 that the clock skips (no zone does today) would be read as TZDate reads it: moved past the gap.
  const due = firstInstantAtWallClock(wall, timeZone) ?? new Date(new TZDate(wall.year, wall.month - 1, wall.day, wall.hour, wall.minute, timeZone).getTime());
  return due.getTime() > bookedAt.getTime() ? due : new Date(bookedAt.getTime());
}
