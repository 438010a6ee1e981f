/**
 * A date and time as a person types it into a `datetime-local` field (`2026-12-04T09:30`), read
 * on the clock of the firm's office, and back. Safe for islands and the server alike.
 */
import { format } from 'date-fns';
import { TZDate, tz } from '@date-fns/tz';
import { zoneOrUtc } from './time';

const SHAPE = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})$/;

/**
 * The moment the firm's wall clock shows `value`. Null for a malformed value and for a time the
 * clock never shows (the hour skipped when summer time starts), so nothing is silently moved.
 */
export function localInputToInstant(value: string, timeZone: string): Date | null {
  const match = SHAPE.exec(value);
  if (!match) return null;
  const [year, month, day, hour, minute] = match.slice(1).map(Number) as [number, number, number, number, number];
  const zone = zoneOrUtc(timeZone);
  const at = new TZDate(year, month - 1, day, hour, minute, zone);
  if (Number.isNaN(at.getTime())) return null;
  // A date that does not exist (Feb 30) or a skipped hour comes back as another wall-clock time.
  if (instantToLocalInput(at, zone) !== value) return null;
  return new Date(at.getTime());
}

/** The value a `datetime-local` field shows for `at` on the firm's clock. */
export function instantToLocalInput(at: Date | string | number, timeZone: string): string {
  return format(new Date(at), "yyyy-MM-dd'T'HH:mm", { in: tz(zoneOrUtc(timeZone)) });
}
