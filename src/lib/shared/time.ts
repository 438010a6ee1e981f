/**
 * Dates for people, in a firm's time zone. Safe for islands and the server alike.
 *
 * Every date the staff area or an e-mail shows goes through `formatInZone` with the firm's IANA zone
 * (`Company.timeZone`), never the zone of the machine that happens to render it. Patterns are
 * date-fns (Unicode TR35) patterns in English, the staff area's language; date-fns writes them the
 * same on the server and in every browser, so an island hydrates with the text the server sent.
 */
import { format, formatISO } from 'date-fns';
import { tz, tzName } from '@date-fns/tz';

/** A moment: a Date, an ISO 8601 string (as JSON carries it) or milliseconds since the epoch. */
export type Instant = Date | string | number;

/** The ways a moment is written, from shortest to fullest. */
export const DATE_STYLES = {
  /** `Dec 1`: a column in a list. */
  day: 'MMM d',
  /** `Dec 1, 2026` */
  date: 'MMM d, yyyy',
  /** `Dec 1, 2026, 7:19 PM` */
  dateTime: 'MMM d, yyyy, h:mm a',
  /** `Tue, Dec 1, 2026, 7:19 PM CST`: for e-mails, read away from the app, so the zone is named. */
  dateTimeZone: 'EEE, MMM d, yyyy, h:mm a',
} as const;

export type DateStyle = keyof typeof DATE_STYLES;

const knownZones = new Map<string, boolean>();

/** Whether `name` is a time zone this runtime knows (an IANA name such as `America/Chicago`, or `UTC`). */
export function isTimeZone(name: string): boolean {
  if (typeof name !== 'string' || name === '') return false;
  let known = knownZones.get(name);
  if (known === undefined) {
    try {
      new Intl.DateTimeFormat('en-US', { timeZone: name });
      known = true;
    } catch {
      known = false;
    }
    if (knownZones.size > 500) knownZones.clear();
    knownZones.set(name, known);
  }
  return known;
}

/**
 * The zone to write dates in. A stored zone this runtime does not know falls back to UTC, so a
 * page still renders (e-mails then say "UTC", so the time is never passed off as local).
 */
export function zoneOrUtc(timeZone: string): string {
  return isTimeZone(timeZone) ? timeZone : 'UTC';
}

function toDate(at: Instant): Date {
  const date = at instanceof Date ? at : new Date(at);
  if (Number.isNaN(date.getTime())) throw new RangeError(`Not a moment in time: ${String(at)}`);
  return date;
}

/** The zone's short name at that moment: `CST`, `CDT`, `EST`, `UTC`; where English has none, `GMT+1`. */
export function zoneAbbreviation(at: Instant, timeZone: string): string {
  return tzName(zoneOrUtc(timeZone), toDate(at), 'short');
}

/** Writes a moment as the clock on the wall of the firm's office showed it. */
export function formatInZone(at: Instant, timeZone: string, style: DateStyle = 'date'): string {
  const zone = zoneOrUtc(timeZone);
  const date = toDate(at);
  const text = format(date, DATE_STYLES[style], { in: tz(zone) });
  return style === 'dateTimeZone' ? `${text} ${zoneAbbreviation(date, zone)}` : text;
}

/** ISO 8601 with the zone's offset at that moment (`2026-12-01T19:19:00-06:00`), for `<time datetime>`. */
export function isoInZone(at: Instant, timeZone: string): string {
  return formatISO(toDate(at), { in: tz(zoneOrUtc(timeZone)) });
}

/** The calendar day in the zone (`2026-12-01`): two moments are on the same day there if these match. */
export function dayInZone(at: Instant, timeZone: string): string {
  return format(toDate(at), 'yyyy-MM-dd', { in: tz(zoneOrUtc(timeZone)) });
}
