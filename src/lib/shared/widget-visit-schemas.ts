/**
 * The price widget's visit step: what its two public routes take and answer. The homeowner proves
 * the inquiry is theirs with the key of their private estimate link, which the widget received
 * when the inquiry was sent (`lead.viewUrl`, `/estimate/LEAD_ID?key=KEY`).
 */
import { z } from 'zod';
import { widgetBookingSchema } from './visit-schemas';

/** The inquiry and its private key, as the estimate link carries them. Malformed values are simply not found. */
export const inquiryProofSchema = z.strictObject({
  lead: z.string({ error: 'Send the inquiry first.' }).max(64, { error: 'Send the inquiry first.' }),
  key: z.string({ error: 'Send the inquiry first.' }).max(128, { error: 'Send the inquiry first.' }),
});
export type InquiryProof = z.output<typeof inquiryProofSchema>;

/**
 * Body of POST /api/embed/SLUG/visits. The public never names a salesperson: the server takes the
 * inquiry's assignee when free at that time, else the first person free.
 */
export const widgetVisitRequestSchema = widgetBookingSchema.omit({ salespersonId: true }).extend(inquiryProofSchema.shape);
export type WidgetVisitRequest = z.output<typeof widgetVisitRequestSchema>;

/** One open time as the public sees it: no staff names or ids. */
export type PublicSlot = { start: string; end: string };

/** Answer of GET /api/embed/SLUG/slots. `offered: false` (online booking off, nobody with hours): the widget shows no visit step. */
export type WidgetSlotsAnswer = { offered: false; slots: [] } | { offered: true; timeZone: string; zoneLabel: string; slots: PublicSlot[] };

/** Answer of a booking: 201 `{ visit }`; a 409 carries `alternatives: PublicSlot[]`. */
export type WidgetVisitAnswer = { visit: { start: string; end: string; timeZone: string } };
