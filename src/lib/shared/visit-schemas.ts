/**
 * Site visits: the words for their states and the inputs of the availability, booking and
 * self-service routes, shared by the islands and the endpoints.
 */
import { z } from 'zod';
import { isId } from './ids';

export const WEEKDAYS = ['mon', 'tue', 'wed', 'thu', 'fri', 'sat', 'sun'] as const;
export type Weekday = (typeof WEEKDAYS)[number];

export const WEEKDAY_NAMES: Record<Weekday, string> = {
  mon: 'Monday',
  tue: 'Tuesday',
  wed: 'Wednesday',
  thu: 'Thursday',
  fri: 'Friday',
  sat: 'Saturday',
  sun: 'Sunday',
};

export type HoursRange = { from: string; to: string };
export type WeeklyHours = Partial<Record<Weekday, HoursRange[]>>;

/** live → done or no-show after it; or cancelled. Only a cancelled visit frees its time. */
export const VISIT_STATUSES = ['booked', 'cancelled', 'done', 'no-show'] as const;
export type VisitStatus = (typeof VISIT_STATUSES)[number];

export const VISIT_STATUS_LABELS: Record<VisitStatus, string> = {
  booked: 'Booked',
  cancelled: 'Cancelled',
  done: 'Done',
  'no-show': 'No one home',
};

/** Where a booking was made: the price widget, the staff area, or the homeowner's own link. */
export type VisitBookedVia = 'widget' | 'staff' | 'homeowner-link';
export type VisitCancelledBy = 'homeowner' | 'staff';

const CLOCK_TIME = /^([01]\d|2[0-3]):[0-5]\d$/;
const LOCAL_DATE = /^\d{4}-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/;

const minutesOfDay = (hhmm: string) => Number(hhmm.slice(0, 2)) * 60 + Number(hhmm.slice(3));

export const hoursRangeSchema = z
  .strictObject({
    from: z.string({ error: 'Give a start time.' }).regex(CLOCK_TIME, { error: 'Use a time like 09:00.' }),
    to: z.string({ error: 'Give an end time.' }).regex(CLOCK_TIME, { error: 'Use a time like 17:00.' }),
  })
  .refine((range) => minutesOfDay(range.to) > minutesOfDay(range.from), { error: 'The end must be after the start.', path: ['to'] });

/** A day's ranges: at most six, none overlapping another. */
const dayRangesSchema = z
  .array(hoursRangeSchema)
  .max(6, { error: 'At most six ranges a day.' })
  .superRefine((ranges, ctx) => {
    const sorted = ranges.map((r, index) => ({ ...r, index })).sort((a, b) => minutesOfDay(a.from) - minutesOfDay(b.from));
    for (let i = 1; i < sorted.length; i++) {
      if (minutesOfDay(sorted[i]!.from) < minutesOfDay(sorted[i - 1]!.to)) {
        ctx.addIssue({ code: 'custom', message: 'This range overlaps another on the same day.', path: [sorted[i]!.index, 'from'] });
      }
    }
  });

export const weeklyHoursSchema = z.strictObject(
  Object.fromEntries(WEEKDAYS.map((day) => [day, dayRangesSchema.optional()])) as Record<Weekday, z.ZodOptional<typeof dayRangesSchema>>,
);

/** Body of PUT /api/app/visits/availability/MEMBERSHIP_ID. */
export const availabilitySchema = z.strictObject({
  weekly: weeklyHoursSchema,
  daysOff: z
    .array(z.string().regex(LOCAL_DATE, { error: 'Use a date like 2026-12-24.' }))
    .max(366, { error: 'At most 366 days off.' })
    .transform((days) => [...new Set(days)].sort()),
});
export type AvailabilityInput = z.output<typeof availabilitySchema>;

/** Body of PUT /api/app/settings/visits: the firm's visit settings (owners). */
export const visitSettingsSchema = z.strictObject({
  visitMinutes: z
    .number({ error: 'Give the visit length in minutes.' })
    .int()
    .min(15, { error: 'At least 15 minutes.' })
    .max(480, { error: 'At most 8 hours.' }),
  bufferMinutes: z
    .number({ error: 'Give the travel time in minutes.' })
    .int()
    .min(0, { error: 'Zero or more minutes.' })
    .max(240, { error: 'At most 4 hours.' }),
  stepMinutes: z.number({ error: 'Give the step in minutes.' }).int().min(5, { error: 'At least 5 minutes.' }).max(240, { error: 'At most 4 hours.' }),
  minNoticeMinutes: z
    .number({ error: 'Give the notice in minutes.' })
    .int()
    .min(0, { error: 'Zero or more minutes.' })
    .max(14 * 24 * 60, { error: 'At most two weeks.' }),
  horizonDays: z.number({ error: 'Give the number of days.' }).int().min(1, { error: 'At least one day.' }).max(120, { error: 'At most 120 days.' }),
  onlineBooking: z.boolean({ error: 'Choose on or off.' }),
});
export type VisitSettings = z.output<typeof visitSettingsSchema>;

const instant = z.iso.datetime({ offset: true, error: 'Choose a time from the list.' });
const membershipId = z.string({ error: 'Choose someone on your team.' }).refine(isId, { error: 'Choose someone on your team.' });
const note = z.string().trim().max(500, { error: 'Keep the note under 500 characters.' }).optional();

/** Body of POST /api/app/leads/ID/visits (staff booking, also for phone calls). */
export const staffBookingSchema = z.strictObject({
  start: instant,
  salespersonId: membershipId,
  note,
});

/** Body of POST /api/embed/SLUG/visits: the homeowner books from the widget, for the inquiry just sent. */
export const widgetBookingSchema = z.strictObject({
  start: instant,
  /** Whose slot was chosen; absent when the firm offers the team's slots without names. */
  salespersonId: membershipId.optional(),
  note,
});

/** Body of a reschedule, by staff or through the homeowner's link. */
export const rescheduleSchema = z.strictObject({
  start: instant,
  salespersonId: membershipId.optional(),
});

/** Body of POST /api/app/visits/ID/outcome. */
export const visitOutcomeSchema = z.strictObject({ outcome: z.enum(['done', 'no-show'], { error: 'Choose done or no one home.' }) });

/** One open slot as the API sends it: ISO instants and, when known, whose it is. */
export type SlotView = { start: string; end: string; salespersonId?: string };
