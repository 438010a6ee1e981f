/**
 * Inputs of the price widget's public API, shared by the form (react-hook-form resolver) and the
 * endpoints, so a message the homeowner sees is the message the server would give.
 */
import { z } from 'zod';
import { parsePhoneNumberFromString } from 'libphonenumber-js/min';
import { projectSchema } from '~/lib/estimate/schemas.ts';
import { CONTACT_METHODS } from './labels';

/** Phone numbers are read as US numbers unless they start with +; stored as E.164. */
export const DEFAULT_PHONE_COUNTRY = 'US';

export function normalisePhone(value: string): string | null {
  const parsed = parsePhoneNumberFromString(value, DEFAULT_PHONE_COUNTRY);
  return parsed && parsed.isValid() ? parsed.number : null;
}

const required = (label: string, max: number) =>
  z
    .string({ error: `${label} is required.` })
    .trim()
    .min(1, { error: `${label} is required.` })
    .max(max, { error: `${label} must be at most ${max} characters.` });

export const contactSchema = z.strictObject({
  name: required('Your name', 120),
  email: z
    .string({ error: 'E-mail is required.' })
    .trim()
    .toLowerCase()
    .max(254, { error: 'E-mail is too long.' })
    .pipe(z.email({ error: 'Enter an e-mail address like name@example.com.' })),
  phone: z
    .string({ error: 'Phone is required.' })
    .trim()
    .min(1, { error: 'Phone is required.' })
    .max(30, { error: 'Phone is too long.' })
    .transform((value, ctx) => {
      const e164 = normalisePhone(value);
      if (!e164) {
        ctx.addIssue({ code: 'custom', message: 'Enter a phone number we can call, like (512) 555-0147.' });
        return z.NEVER;
      }
      return e164;
    }),
  address: required('Street address', 200),
  postcode: z
    .string({ error: 'ZIP or postcode is required.' })
    .trim()
    .toUpperCase()
    .regex(/^[A-Z0-9][A-Z0-9 -]{1,10}$/, { error: 'Enter a ZIP or postcode, like 78704.' }),
  preferredContact: z.enum(CONTACT_METHODS, { error: 'Choose how you would like to be contacted.' }),
  message: z.string().trim().max(2000, { error: 'Keep the note under 2,000 characters.' }).optional(),
  consent: z.literal(true, { error: 'Please agree to be contacted about this inquiry.' }),
});

export type ContactInput = z.input<typeof contactSchema>;
export type Contact = z.output<typeof contactSchema>;

/** Body of POST /api/embed/SLUG/estimate. */
export const estimateRequestSchema = z.strictObject({
  formToken: z.string({ error: 'The form token is missing; reload the page.' }).min(10).max(600),
  project: projectSchema,
});

/** Body of POST /api/embed/SLUG/leads. */
export const leadRequestSchema = z.strictObject({
  formToken: z.string({ error: 'The form token is missing; reload the page.' }).min(10).max(600),
  /** Chosen by the browser once per send attempt series; the same key twice makes one lead. */
  idempotencyKey: z.string({ error: 'The request key is missing.' }).regex(/^[A-Za-z0-9_-]{16,64}$/, { error: 'The request key is malformed.' }),
  project: projectSchema,
  contact: contactSchema,
  /** A field people never see; software that fills every field fills this one. */
  website: z.string().max(200).optional(),
});

export type LeadRequest = z.input<typeof leadRequestSchema>;
export type LeadRequestParsed = z.output<typeof leadRequestSchema>;
