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

/** Whether the runtime's time zone data knows `name` (an IANA name such as `Europe/London`). */
export function isKnownTimeZone(name: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: name });
    return true;
  } catch {
    return false;
  }
}
