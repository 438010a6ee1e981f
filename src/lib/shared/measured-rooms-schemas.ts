/**
 * The rooms as measured on the site visit, shared by the inquiry page's form and
 * PUT /api/app/leads/ID/measured-rooms: the estimating core's own project schema, so the measured
 * rooms are checked exactly as the widget's and the phone form's are.
 */
import { z } from 'zod';
import { projectSchema } from '~/lib/estimate/schemas.ts';

/** Body of PUT /api/app/leads/ID/measured-rooms. The server records them as a site measurement, whatever `measuredBy` says. */
export const measuredRoomsSchema = z.strictObject({ project: projectSchema });

export type MeasuredRoomsRequest = z.input<typeof measuredRoomsSchema>;

/** How the earlier and the new range are kept on the `re-estimated` timeline entry. */
export type RangeCents = { lowCents: number; highCents: number };
