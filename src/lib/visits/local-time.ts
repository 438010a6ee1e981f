/**
 * Wall-clock times in an IANA zone, read and made through @date-fns/tz. Pure.
 *
 * `new TZDate(y, m, d, h, min, zone)` always returns some instant, even for a local time the zone
 * never shows, and which of two instants it picks for a repeated local time differs between zones
 * (America/New_York gives the first, Europe/London the second). So every local time made here is
 * read back: a time whose fields come back different does not exist, and for a repeated time the
 * earlier instant is chosen explicitly.
 */
import { TZDate, tzOffset } from '@date-fns/tz';

/** A calendar date and a time of day on a zone's clock (month 1–12). */
export type WallClock = { year: number; month: number; day: number; hour: number; minute: number };

/** The zone's clock at an instant, to the minute. */
export function wallClockAt(at: Date, timeZone: string): WallClock {
  const local = new TZDate(at.getTime(), timeZone);
  return { year: local.getFullYear(), month: local.getMonth() + 1, day: local.getDate(), hour: local.getHours(), minute: local.getMinutes() };
}

const sameWallClock = (at: number, wanted: WallClock, timeZone: string) => {
  const seen = new TZDate(at, timeZone);
  return (
    seen.getFullYear() === wanted.year &&
    seen.getMonth() + 1 === wanted.month &&
    seen.getDate() === wanted.day &&
    seen.getHours() === wanted.hour &&
    seen.getMinutes() === wanted.minute &&
    seen.getSeconds() === 0
  );
};

/** Half a day: no zone changes its offset twice that close together. */
const NEAR_MS = 12 * 60 * 60 * 1000;

/**
 * Every instant at which the zone's clock shows `wall` (seconds 0), earliest first: none on a
 * spring-forward gap, two on a fall-back overlap, one otherwise.
 */
export function instantsAtWallClock(wall: WallClock, timeZone: string): Date[] {
  const guess = new TZDate(wall.year, wall.month - 1, wall.day, wall.hour, wall.minute, timeZone).getTime();
  // The same wall-clock reading under each offset the zone has near the guess: the guess moved by
  // the difference between its own offset and that one. Each is kept only if the zone really
  // shows the wanted reading at it.
  const offsetAtGuess = tzOffset(timeZone, new Date(guess));
  const offsets = new Set([offsetAtGuess, tzOffset(timeZone, new Date(guess - NEAR_MS)), tzOffset(timeZone, new Date(guess + NEAR_MS))]);
  const found = new Set<number>();
  for (const offset of offsets) {
    const at = guess + (offsetAtGuess - offset) * 60_000;
    if (sameWallClock(at, wall, timeZone)) found.add(at);
  }
  return [...found].sort((a, b) => a - b).map((at) => new Date(at));
}

/**
 * The first instant at which the zone's clock shows `wall`, or null when it never does (the
 * reading falls in a spring-forward gap).
 */
export function firstInstantAtWallClock(wall: WallClock, timeZone: string): Date | null {
  return instantsAtWallClock(wall, timeZone)[0] ?? null;
}

/** A calendar date (month 1–12). */
export type CalendarDate = Pick<WallClock, 'year' | 'month' | 'day'>;

/** One local date of a zone: its wall-clock times as instants, and the clock at instants near it. */
export type LocalDay = {
  /** The first instant the clock shows `minuteOfDay` (0–1439) on this date, or null if it never does. */
  firstInstantAt(minuteOfDay: number): Date | null;
  wallClockAt(at: Date): WallClock;
};

const HOUR_MS = 60 * 60 * 1000;

/**
 * The zone's clock on one local date. Reading every candidate time through TZDate costs a few Intl
 * calls each, and a year of one-minute steps is half a million of them. So the zone's offset is
 * read (through @date-fns/tz) at three instants spanning the date and 14 hours either side (no zone
 * is further from UTC, and no zone changes twice within two days): when all three agree, the date
 * has no change near it and each time is that fixed offset from UTC. A date near a change takes
 * the careful path above, time by time.
 */
export function localDay(date: CalendarDate, timeZone: string): LocalDay {
  const midnightGuess = new TZDate(date.year, date.month - 1, date.day, 0, 0, timeZone).getTime();
  const windowStart = midnightGuess - 15 * HOUR_MS;
  const windowEnd = midnightGuess + 39 * HOUR_MS;
  const offsets = [windowStart, midnightGuess + 12 * HOUR_MS, windowEnd].map((at) => tzOffset(timeZone, new Date(at)));
  const steady = offsets.every((offset) => offset === offsets[0]);
  if (!steady) {
    return {
      firstInstantAt: (minute) => firstInstantAtWallClock({ ...date, hour: Math.floor(minute / 60), minute: minute % 60 }, timeZone),
      wallClockAt: (at) => wallClockAt(at, timeZone),
    };
  }
  const offsetMs = offsets[0]! * 60_000;
  return {
    firstInstantAt: (minute) => new Date(Date.UTC(date.year, date.month - 1, date.day, 0, minute) - offsetMs),
    wallClockAt(at) {
      const time = at.getTime();
      if (time < windowStart || time > windowEnd) return wallClockAt(at, timeZone);
      const shown = new Date(time + offsetMs);
      return {
        year: shown.getUTCFullYear(),
        month: shown.getUTCMonth() + 1,
        day: shown.getUTCDate(),
        hour: shown.getUTCHours(),
        minute: shown.getUTCMinutes(),
      };
    },
  };
}

/** Whether the runtime's time zone data knows `name` (an IANA name such as `Europe/London`). */
export function isKnownTimeZone(name: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: name });
    return true;
  } catch {
    return false;
  }
}
