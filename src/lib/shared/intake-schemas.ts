/**
 * Inputs of the staff routes for inquiries coming in and kept tidy, shared by the islands and the
 * endpoints: a phone inquiry typed in by staff, a merge, the new-inquiry e-mail setting.
 */
import { z } from 'zod';
import { projectSchema } from '~/lib/estimate/schemas.ts';
import { idSchema } from './ids';
import { contactSchema } from './lead-schemas';

/** The homeowner's details as staff take them down on the phone; the same rules as the widget's, in staff words. */
export const staffContactSchema = contactSchema.extend({
  name: z
    .string({ error: "The homeowner's name is required." })
    .trim()
    .min(1, { error: "The homeowner's name is required." })
    .max(120, { error: 'The name must be at most 120 characters.' }),
  consent: z.literal(true, { error: 'Confirm that the homeowner agreed to be contacted about this inquiry.' }),
});

export type StaffContactInput = z.input<typeof staffContactSchema>;

/** Body of POST /api/app/leads. */
export const staffLeadRequestSchema = z.strictObject({
  /** Chosen by the page once per form: a double click or a retried save makes one inquiry. */
  idempotencyKey: z.string({ error: 'The request key is missing.' }).regex(/^[A-Za-z0-9_-]{16,64}$/, { error: 'The request key is malformed.' }),
  project: projectSchema,
  contact: staffContactSchema,
});

export type StaffLeadRequest = z.input<typeof staffLeadRequestSchema>;

/** Body of POST /api/app/leads/ID/merge: the inquiry that stays. */
export const mergeRequestSchema = z.strictObject({
  into: z.string({ error: 'Choose the inquiry to keep.' }).pipe(idSchema),
});

/** Body of PATCH /api/app/me/notifications. */
export const notificationSettingsSchema = z.strictObject({
  newInquiryMail: z.boolean({ error: 'Choose on or off.' }),
});

/** Body of POST /api/app/leads/estimate: the live range while staff type the rooms in. */
export const staffEstimateRequestSchema = z.strictObject({ project: projectSchema });
