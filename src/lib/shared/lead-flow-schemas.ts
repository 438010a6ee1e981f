/**
 * Inputs of the inquiry page's workflow routes (stage, assignee, follow-up) and of the owner's
 * list of reasons an inquiry is not going ahead; shared by the islands and the endpoints.
 */
import { z } from 'zod';
import { LEAD_STAGE_IDS } from './labels';
import { isId } from './ids';

/** Body of POST /api/app/leads/ID/stage. */
export const stageMoveSchema = z.strictObject({
  to: z.enum(LEAD_STAGE_IDS, { error: 'Choose a stage.' }),
  reason: z
    .string({ error: 'Choose a reason.' })
    .trim()
    .min(1, { error: 'Choose a reason.' })
    .max(120, { error: 'Keep the reason under 120 characters.' })
    .optional(),
  confirm: z.boolean({ error: 'Confirm with true or false.' }).optional(),
});
export type StageMove = z.output<typeof stageMoveSchema>;

/** Body of PUT /api/app/leads/ID/assignee: a membership of the firm, or null for nobody. */
export const assigneeSchema = z.strictObject({
  membershipId: z.string({ error: 'Choose someone on your team, or nobody.' }).refine(isId, { error: 'Choose someone on your team.' }).nullable(),
});

/** A date and time as a `datetime-local` field gives it (`2026-12-04T09:30`), read in the firm's zone. */
export const LOCAL_DATE_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/;

/** Body of PUT /api/app/leads/ID/follow-up: when to follow up, or null to clear it. */
export const followUpSchema = z.strictObject({
  at: z.string({ error: 'Choose a date and time.' }).regex(LOCAL_DATE_TIME, { error: 'Choose a date and time.' }).nullable(),
});

/** What a firm starts with; the owner edits the list under Setup. */
export const DEFAULT_LOST_REASONS = ['Price', 'Timing', 'Chose another firm', 'Doing it themselves', 'No reply', 'Outside our area'] as const;

export const MAX_LOST_REASONS = 30;

/** Body of PUT /api/app/settings/lost-reasons. */
export const lostReasonsSchema = z
  .strictObject({
    reasons: z
      .array(
        z
          .string({ error: 'Write a reason.' })
          .trim()
          .min(1, { error: 'Write a reason, or remove this line.' })
          .max(120, { error: 'Keep a reason under 120 characters.' }),
        { error: 'Give a list of reasons.' },
      )
      .min(1, { error: 'Keep at least one reason.' })
      .max(MAX_LOST_REASONS, { error: `At most ${MAX_LOST_REASONS} reasons.` }),
  })
  .superRefine(({ reasons }, ctx) => {
    const seen = new Set<string>();
    reasons.forEach((reason, index) => {
      const key = reason.trim().toLowerCase();
      if (seen.has(key)) ctx.addIssue({ code: 'custom', path: ['reasons', index], message: 'This reason is already on the list.' });
      seen.add(key);
    });
  });
export type LostReasonsInput = z.input<typeof lostReasonsSchema>;
