/**
 * The homeowner's own page for a visit (the link in its e-mails): what the page and its island
 * show, and the inputs of its two routes. Safe for islands and the server alike.
 */
import { z } from 'zod';
import type { SlotView } from './visit-schemas';

/** open: can be moved or cancelled; under-way: started, not over; cancelled or over: the link only says so. */
export type HomeownerLinkState = 'open' | 'under-way' | 'cancelled' | 'over';

export type HomeownerVisitView = {
  state: HomeownerLinkState;
  firm: { name: string; phone: string | null };
  /** The firm's IANA zone: every time on the page is on its clock, labelled with it. */
  timeZone: string;
  start: string;
  end: string;
  salespersonName: string | null;
  /** The job's street address and postcode. */
  place: string;
  /** Other open times to move to (only while `open`). */
  slots: SlotView[];
};

/** Body of POST /api/visit/TOKEN/cancel: nothing to say but yes (the island asked first). */
export const homeownerCancelSchema = z.strictObject({});

/** How long a visit takes, in words: "about an hour", "about an hour and a half", "about 45 minutes". */
export function aboutHowLong(start: Date, end: Date): string {
  const minutes = Math.round((end.getTime() - start.getTime()) / 60_000);
  if (minutes === 60) return 'about an hour';
  if (minutes === 90) return 'about an hour and a half';
  if (minutes >= 120 && minutes % 60 === 0) return `about ${minutes / 60} hours`;
  return `about ${minutes} minutes`;
}
