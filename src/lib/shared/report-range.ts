/**
 * The owner's Reports: which reports there are, and the date range they cover. One schema for the
 * page's form and the CSV routes, so both refuse the same input with the same field messages.
 * Days are calendar days on the firm's clock (`YYYY-MM-DD`); the range is half-open, [from, to).
 * Safe for islands and the server alike.
 */
import { z } from 'zod';

export const REPORT_NAMES = ['funnel', 'response-times', 'value-by-finish', 'sources'] as const;
export type ReportName = (typeof REPORT_NAMES)[number];

export function isReportName(name: string): name is ReportName {
  return (REPORT_NAMES as readonly string[]).includes(name);
}

/** Weeks shown when no range is asked for: the current week and the eleven before it. */
export const DEFAULT_REPORT_WEEKS = 12;
/** The longest range one request reads: two years (a leap day included). */
export const MAX_REPORT_DAYS = 731;
/** Years a range may fall in: anything else is a typo, and JavaScript reads years below 100 as 19xx. */
const FIRST_YEAR = 2000;
const LAST_YEAR = 2099;

const DAY_MS = 24 * 60 * 60 * 1000;

/** Days since 1970-01-01 of a `YYYY-MM-DD` day (a calendar day, no zone). */
function dayNumber(day: string): number {
  return Date.UTC(Number(day.slice(0, 4)), Number(day.slice(5, 7)) - 1, Number(day.slice(8, 10))) / DAY_MS;
}

function dayOf(number: number): string {
  return new Date(number * DAY_MS).toISOString().slice(0, 10);
}

export function addDays(day: string, days: number): string {
  return dayOf(dayNumber(day) + days);
}

/** Days from `from` to `to` (negative when `to` comes first). */
export function daysBetween(from: string, to: string): number {
  return dayNumber(to) - dayNumber(from);
}

/** The Monday on or before a day: weeks start on Monday (ISO 8601). */
export function mondayOf(day: string): string {
  const weekday = new Date(dayNumber(day) * DAY_MS).getUTCDay(); // 0 = Sunday
  return addDays(day, -((weekday + 6) % 7));
}

/** The range shown when none is asked for, `today` being the firm's day: the last twelve weeks, this one included. */
export function defaultReportRange(today: string): ReportRange {
  const to = addDays(mondayOf(today), 7);
  return { from: addDays(to, -7 * DEFAULT_REPORT_WEEKS), to };
}

const day = (label: string) =>
  z.preprocess(
    // An emptied date field is sent as `from=`: the same as not asking.
    (value) => (value === '' ? undefined : value),
    z.iso
      .date({ error: `Give ${label} as a date (YYYY-MM-DD).` })
      .refine((text) => Number(text.slice(0, 4)) >= FIRST_YEAR && Number(text.slice(0, 4)) <= LAST_YEAR, {
        error: `Give ${label} between ${FIRST_YEAR} and ${LAST_YEAR}.`,
      })
      .optional(),
  );

export type ReportRange = { from: string; to: string };

/**
 * The range of a report request, for the firm whose day it is `today` (`YYYY-MM-DD` on its clock).
 * A missing end is twelve weeks after the start (or the end of this week); a missing start is twelve
 * weeks before the end. The end must come after the start, at most two years later.
 */
export function reportRangeSchema(today: string) {
  return z
    .strictObject({ from: day('the first day'), to: day('the day to stop before') })
    .transform(({ from, to }): ReportRange => {
      const end = to ?? (from ? addDays(from, 7 * DEFAULT_REPORT_WEEKS) : defaultReportRange(today).to);
      return { from: from ?? addDays(end, -7 * DEFAULT_REPORT_WEEKS), to: end };
    })
    .superRefine((range, ctx) => {
      const days = daysBetween(range.from, range.to);
      if (days <= 0) ctx.addIssue({ code: 'custom', path: ['to'], message: 'The day to stop before must come after the first day.' });
      else if (days > MAX_REPORT_DAYS) ctx.addIssue({ code: 'custom', path: ['to'], message: 'Ask for at most two years at once.' });
    });
}
