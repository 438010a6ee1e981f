/**
 * What `openSlots` accepts, checked before any work: one zod schema, and one typed error naming
 * the first field at fault (`weekly.mon.1.to`, `timeZone`, `daysOff.0`). The caps keep the work a
 * call can ask for bounded, whatever a stored setting or a request says.
 */
import { z } from 'zod';
import { isKnownTimeZone } from './local-time.ts';

export const WEEKDAYS = ['sun', 'mon', 'tue', 'wed', 'thu', 'fri', 'sat'] as const;
export type Weekday = (typeof WEEKDAYS)[number];

/** The most local dates a call may look ahead: a year, leap day included. */
export const MAX_HORIZON_DAYS = 366;
/** The most ranges one weekday may have. */
export const MAX_RANGES_PER_DAY = 24;
export const MAX_BUSY_RANGES = 10_000;
export const MAX_DAYS_OFF = 1_000;
/** Minutes in a day: no visit, and no step between starts, is longer. */
export const MINUTES_PER_DAY = 24 * 60;
/** The longest buffer or minimum notice: the horizon itself. */
export const MAX_LEAD_MINUTES = MAX_HORIZON_DAYS * MINUTES_PER_DAY;

export class SlotInputError extends Error {
  override name = 'SlotInputError';
  /** Where the fault is, as a dotted path into the input (`weekly.mon.1.to`). */
  readonly path: string;
  /** Every fault found, by path (the first one is `path`): ready for an `{error, fields}` answer. */
  readonly fields: Record<string, string>;

  constructor(path: string, message: string, fields: Record<string, string> = { [path]: message }) {
    super(`${path}: ${message}`);
    this.path = path;
    this.fields = fields;
  }
}

const HH_MM = /^([01]\d|2[0-3]):([0-5]\d)$/;

/** Minutes after midnight of an `HH:MM` already checked by the schema. */
export const minutesOfDay = (hhmm: string) => Number(hhmm.slice(0, 2)) * 60 + Number(hhmm.slice(3, 5));

const wallTime = z.string().regex(HH_MM, 'Use HH:MM on a 24-hour clock (00:00 to 23:59).');

const range = z.strictObject({ from: wallTime, to: wallTime }).superRefine((r, ctx) => {
  if (HH_MM.test(r.from) && HH_MM.test(r.to) && minutesOfDay(r.to) <= minutesOfDay(r.from)) {
    ctx.addIssue({ code: 'custom', path: ['to'], message: 'The end must be later than the start on the same day.' });
  }
});

const dayRanges = z
  .array(range)
  .max(MAX_RANGES_PER_DAY, `At most ${MAX_RANGES_PER_DAY} ranges a day.`)
  .superRefine((ranges, ctx) => {
    // Overlapping ranges would offer the same time twice; the firm means one range.
    ranges.forEach((r, i) => {
      if (!HH_MM.test(r.from) || !HH_MM.test(r.to)) return;
      const clash = ranges.findIndex(
        (other, j) =>
          j !== i &&
          HH_MM.test(other.from) &&
          HH_MM.test(other.to) &&
          minutesOfDay(other.from) < minutesOfDay(r.to) &&
          minutesOfDay(r.from) < minutesOfDay(other.to),
      );
      if (clash !== -1 && clash < i) ctx.addIssue({ code: 'custom', path: [i, 'from'], message: `Overlaps range ${clash} of the same day.` });
    });
  });

const wholeMinutes = (min: number, max: number) =>
  z
    .number('Give a number of minutes.')
    .refine(Number.isFinite, 'Give a finite number of minutes.')
    .refine(Number.isInteger, 'Give whole minutes.')
    .refine((n) => n >= min, min === 0 ? 'Cannot be negative.' : `Must be at least ${min}.`)
    .refine((n) => n <= max, `At most ${max} minutes.`);

const instant = z.date('Give a moment in time (a Date).').refine((d) => Number.isFinite(d.getTime()), 'Not a valid date.');

/** A real calendar date, `YYYY-MM-DD` (2026-02-30 is refused). */
const localDate = z
  .string('Give a date as YYYY-MM-DD.')
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Give a date as YYYY-MM-DD.')
  .refine((s) => {
    const [y, m, d] = s.split('-').map(Number) as [number, number, number];
    const date = new Date(Date.UTC(y, m - 1, d));
    return date.getUTCFullYear() === y && date.getUTCMonth() === m - 1 && date.getUTCDate() === d;
  }, 'Not a date on the calendar.');

export const slotInputSchema = z.strictObject({
  timeZone: z.string('Give an IANA time zone name.').refine(isKnownTimeZone, 'Not a time zone this runtime knows (use an IANA name such as Europe/London).'),
  weekly: z.strictObject(Object.fromEntries(WEEKDAYS.map((day) => [day, dayRanges.optional()])) as Record<Weekday, z.ZodOptional<typeof dayRanges>>),
  daysOff: z.array(localDate).max(MAX_DAYS_OFF, `At most ${MAX_DAYS_OFF} days off.`).optional(),
  visitMinutes: wholeMinutes(1, MINUTES_PER_DAY),
  bufferMinutes: wholeMinutes(0, MAX_LEAD_MINUTES),
  stepMinutes: wholeMinutes(1, MINUTES_PER_DAY),
  minNoticeMinutes: wholeMinutes(0, MAX_LEAD_MINUTES),
  horizonDays: z
    .number('Give a number of days.')
    .refine(Number.isFinite, 'Give a finite number of days.')
    .refine(Number.isInteger, 'Give whole days.')
    .refine((n) => n >= 0, 'Cannot be negative.')
    .refine((n) => n <= MAX_HORIZON_DAYS, `At most ${MAX_HORIZON_DAYS} days ahead.`),
  busy: z
    .array(
      z.strictObject({ start: instant, end: instant }).superRefine((b, ctx) => {
        if (Number.isFinite(b.start.getTime()) && Number.isFinite(b.end.getTime()) && b.end.getTime() < b.start.getTime()) {
          ctx.addIssue({ code: 'custom', path: ['end'], message: 'The end is before the start.' });
        }
      }),
    )
    .max(MAX_BUSY_RANGES, `At most ${MAX_BUSY_RANGES} busy ranges.`),
  now: instant,
});

export type SlotInput = z.infer<typeof slotInputSchema>;

/** The input checked, or a SlotInputError naming the first field at fault. */
export function checkSlotInput(input: unknown): SlotInput {
  const parsed = slotInputSchema.safeParse(input);
  if (parsed.success) return parsed.data;
  const fields: Record<string, string> = {};
  for (const issue of parsed.error.issues) {
    // An unknown key is named itself (`weekly.monday`), not only the object holding it.
    const keys = issue.code === 'unrecognized_keys' ? issue.keys : [undefined];
    for (const key of keys) {
      const path = [...issue.path, ...(key === undefined ? [] : [key])].map(String).join('.') || 'input';
      fields[path] ??= key === undefined ? issue.message : 'Not a field of this input.';
    }
  }
  const [path, message] = Object.entries(fields)[0]!;
  throw new SlotInputError(path, message, fields);
}
