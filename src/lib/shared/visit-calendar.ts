/**
 * The staff side of Visits: the calendar's query and what it answers, and the firm's visit settings
 * with its time zone. Shared by the islands and the endpoints.
 */
import { z } from 'zod';
import { isId } from './ids';
import { isTimeZone } from './time';
import { visitSettingsSchema, type VisitStatus } from './visit-schemas';

/** The longest range the calendar asks for at once: six weeks, a month view's worth. */
export const MAX_CALENDAR_DAYS = 42;
const DAY_MS = 24 * 60 * 60 * 1000;

const instant = (what: string) => z.iso.datetime({ offset: true, error: `Give the ${what} as an ISO 8601 time.` });

/** Query of GET /api/app/visits: `from` (inclusive) and `to` (exclusive), optionally one salesperson. */
export const calendarQuerySchema = z
  .strictObject({
    from: instant('start'),
    to: instant('end'),
    salespersonId: z.string().refine(isId, { error: 'Choose someone on your team.' }).optional(),
  })
  .superRefine((query, ctx) => {
    const span = Date.parse(query.to) - Date.parse(query.from);
    if (span <= 0) ctx.addIssue({ code: 'custom', message: 'The end must be after the start.', path: ['to'] });
    else if (span > MAX_CALENDAR_DAYS * DAY_MS) ctx.addIssue({ code: 'custom', message: `Ask for at most ${MAX_CALENDAR_DAYS} days at once.`, path: ['to'] });
  });
export type CalendarQuery = z.output<typeof calendarQuerySchema>;

/** One visit on the calendar. Cancelled visits are left out; done and no-show ones stay, marked. */
export type CalendarVisit = {
  id: string;
  leadId: string;
  leadName: string;
  reference: string;
  address: string;
  postcode: string;
  salespersonId: string | null;
  salespersonName: string | null;
  start: string;
  end: string;
  status: VisitStatus;
  note: string | null;
};

/** Whose calendar it is: everyone in the firm who may take visits. */
export type CalendarPerson = { id: string; name: string };

/** Body of PUT /api/app/settings/visits: the visit rules and the firm's IANA time zone. */
export const firmVisitSettingsSchema = visitSettingsSchema.extend({
  timeZone: z
    .string({ error: 'Choose a time zone.' })
    .trim()
    .refine(isTimeZone, { error: 'We do not know this time zone. Use a name like America/Chicago or Europe/London.' }),
});
export type FirmVisitSettings = z.output<typeof firmVisitSettingsSchema>;

/** A person's weekly hours and days off as the availability route answers them. */
export type AvailabilityView = {
  membershipId: string;
  name: string;
  weekly: Partial<Record<'mon' | 'tue' | 'wed' | 'thu' | 'fri' | 'sat' | 'sun', { from: string; to: string }[]>>;
  daysOff: string[];
};
