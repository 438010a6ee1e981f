import { TZDate } from '@date-fns/tz';
import { zoneOrUtc } from '~/lib/shared/time';
import { addDays, mondayOf, type ReportRange } from '~/lib/shared/report-range';

/** A report's range as the database reads it: the firm's days turned into moments, and the weeks it touches. */
export type ReportPeriod = ReportRange & {
  timeZone: string;
  /** Local midnight at the start of `from`, and of `to` (not included). */
  start: Date;
  end: Date;
  /** The Monday of every week the range touches, oldest first; the first and last may be partly outside it. */
  weeks: string[];
};

/** Midnight at the start of a day on the zone's clock (its rules decide the offset, daylight time included). */
export function startOfDayInZone(day: string, timeZone: string): Date {
  return new Date(new TZDate(Number(day.slice(0, 4)), Number(day.slice(5, 7)) - 1, Number(day.slice(8, 10)), 0, 0, 0, 0, timeZone).getTime());
}

export function reportPeriod(range: ReportRange, firmZone: string): ReportPeriod {
  const timeZone = zoneOrUtc(firmZone);
  const weeks: string[] = [];
  for (let monday = mondayOf(range.from); monday < range.to; monday = addDays(monday, 7)) weeks.push(monday);
  return { ...range, timeZone, start: startOfDayInZone(range.from, timeZone), end: startOfDayInZone(range.to, timeZone), weeks };
}

/**
 * SQL for the Monday (`YYYY-MM-DD`) of the firm's week a timestamp column falls in; one `?` for the zone.
 * PostgreSQL's `date_trunc('week', …)` starts weeks on Monday (ISO 8601).
 */
export const weekOf = (column: string) => `to_char(date_trunc('week', ${column} at time zone ?), 'YYYY-MM-DD')`;
