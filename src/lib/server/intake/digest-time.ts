/**
 * When "07:30 on the firm's clock" is, as an instant, on any day: the offset of the firm's IANA zone
 * comes from the runtime's time zone data through Intl, so the digest keeps to the office's morning
 * across daylight-saving changes. Pure.
 */

/** The digest goes out at this time on the firm's clock. */
export const DIGEST_LOCAL_TIME = { hour: 7, minute: 30 } as const;

const formatters = new Map<string, Intl.DateTimeFormat>();

function partsFormatter(timeZone: string): Intl.DateTimeFormat {
  let f = formatters.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', {
      timeZone,
      hourCycle: 'h23',
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      second: '2-digit',
    });
    formatters.set(timeZone, f);
  }
  return f;
}

/** The wall clock of the zone at an instant, as if it were UTC (milliseconds). */
function wallClockMs(at: number, timeZone: string): number {
  const parts = Object.fromEntries(
    partsFormatter(timeZone)
      .formatToParts(new Date(at))
      .map((p) => [p.type, p.value]),
  );
  return Date.UTC(Number(parts.year), Number(parts.month) - 1, Number(parts.day), Number(parts.hour), Number(parts.minute), Number(parts.second));
}

/** How far the zone's clock is ahead of UTC at that instant. */
const offsetMs = (at: number, timeZone: string) => wallClockMs(at, timeZone) - Math.floor(at / 1000) * 1000;

/**
 * The instant the zone's clock shows `hour:minute` on `day` (`YYYY-MM-DD`). As RFC 5545 §3.3.5
 * reads local times: one skipped by a spring-forward change is taken with the offset before the gap
 * (02:30 becomes 03:30), one shown twice by a fall-back change is the first.
 */
export function instantAtLocalTime(day: string, timeZone: string, hour: number, minute: number): Date {
  const [y, m, d] = day.split('-').map(Number) as [number, number, number];
  const wall = Date.UTC(y, m - 1, d, hour, minute);
  // Two guesses settle it: the offset before and after the wanted wall time.
  const early = wall - offsetMs(wall - 12 * 3600_000, timeZone);
  const late = wall - offsetMs(wall + 12 * 3600_000, timeZone);
  const candidates = [early, late].filter((t) => wallClockMs(t, timeZone) === wall).sort((a, b) => a - b);
  if (candidates.length) return new Date(candidates[0]!);
  // In a gap the wall time never happens: read with the offset before the gap (the later instant).
  return new Date(Math.max(early, late));
}

/** The calendar day of the zone at an instant, `YYYY-MM-DD`. */
export function localDay(at: Date, timeZone: string): string {
  return new Date(wallClockMs(at.getTime(), timeZone)).toISOString().slice(0, 10);
}

const nextDay = (day: string) => new Date(Date.parse(`${day}T00:00:00Z`) + 36 * 3600_000).toISOString().slice(0, 10);

/** The next digest time strictly after `after`, on the zone's clock. */
export function nextDigestAt(after: Date, timeZone: string, { hour, minute } = DIGEST_LOCAL_TIME): Date {
  const today = localDay(after, timeZone);
  const todays = instantAtLocalTime(today, timeZone, hour, minute);
  return todays.getTime() > after.getTime() ? todays : instantAtLocalTime(nextDay(today), timeZone, hour, minute);
}

/** Whether today's digest is due at `now`: the zone's clock has passed the digest time today. */
export function digestDueToday(now: Date, timeZone: string, { hour, minute } = DIGEST_LOCAL_TIME): { due: boolean; day: string } {
  const day = localDay(now, timeZone);
  return { due: now.getTime() >= instantAtLocalTime(day, timeZone, hour, minute).getTime(), day };
}
