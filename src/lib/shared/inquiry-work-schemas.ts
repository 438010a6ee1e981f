/**
 * Inputs of the day-to-day work on one inquiry (notes, calls, e-mails) and of the firm's e-mail
 * templates, shared by the inquiry page's islands, the template screen and the staff routes.
 */
import { z } from 'zod';
import { idSchema } from './ids';
import { unknownPlaceholders } from './mail-placeholders';

const text = (label: string, max: number) =>
  z
    .string({ error: `${label} is required.` })
    .trim()
    .min(1, { error: `${label} is required.` })
    .max(max, { error: `${label} must be at most ${max} characters.` });

/** Long enough for a page of notes; far below the JSON body limit. common practice, no source. */
export const NOTE_MAX = 4000;
export const CALL_NOTE_MAX = 1000;
export const SUBJECT_MAX = 200;
export const BODY_MAX = 10_000;

export const noteSchema = z.strictObject({ text: text('Note', NOTE_MAX) });

export const CALL_OUTCOMES = ['reached', 'voicemail', 'no-answer'] as const;
export type CallOutcome = (typeof CALL_OUTCOMES)[number];
export const CALL_OUTCOME_LABELS: Record<CallOutcome, string> = { reached: 'Spoke with them', voicemail: 'Left a voicemail', 'no-answer': 'No answer' };

export const callSchema = z.strictObject({
  outcome: z.enum(CALL_OUTCOMES, { error: 'Choose how the call went.' }),
  note: z
    .string()
    .trim()
    .max(CALL_NOTE_MAX, { error: `The call note must be at most ${CALL_NOTE_MAX} characters.` })
    .optional()
    .transform((v) => v || undefined),
});

/** A text that may use only the known placeholders. */
const withPlaceholders = (label: string, max: number) =>
  text(label, max).superRefine((value, ctx) => {
    const unknown = unknownPlaceholders(value);
    if (unknown.length) ctx.addIssue({ code: 'custom', message: `Unknown placeholder: ${unknown.map((k) => `{${k}}`).join(', ')}.` });
  });

export const mailTemplateSchema = z.strictObject({
  name: text('Name', 80),
  subject: withPlaceholders('Subject', SUBJECT_MAX),
  body: withPlaceholders('Message', BODY_MAX),
});
export type MailTemplateInput = z.input<typeof mailTemplateSchema>;

export const leadEmailSchema = z.strictObject({
  /** The template it started from, if any (kept on the timeline). */
  templateId: idSchema.nullable().optional(),
  subject: withPlaceholders('Subject', SUBJECT_MAX),
  body: withPlaceholders('Message', BODY_MAX),
});
export type LeadEmailInput = z.input<typeof leadEmailSchema>;

/** A template as islands get it. */
export type MailTemplateView = { id: string; name: string; subject: string; body: string };
