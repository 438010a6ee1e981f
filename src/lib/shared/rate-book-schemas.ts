/**
 * Bodies of the Rate book's staff API, shared by its islands and routes. The numbers themselves
 * (`data`) are checked by the estimating core's own `rateBookSchema` on the server (one schema, no
 * copy); these only say which revision of the draft the owner started from.
 */
import { z } from 'zod';
import { idSchema } from './ids';

const revision = z
  .number({ error: 'The draft revision is required.' })
  .int({ error: 'The draft revision must be a whole number.' })
  .min(1, { error: 'The draft revision must be at least 1.' })
  .max(2_000_000_000, { error: 'The draft revision is too large.' });

const note = z.string({ error: 'The note must be text.' }).trim().max(200, { error: 'The note must be at most 200 characters.' });

export const openDraftSchema = z.strictObject({ fromVersionId: idSchema.optional() });
export const saveDraftSchema = z.strictObject({ revision, data: z.unknown(), note: note.nullable().optional() });
export const publishDraftSchema = z.strictObject({ revision, note: note.optional() });
export const discardDraftSchema = z.strictObject({ revision });
export const compareVersionsSchema = z.strictObject({
  before: idSchema,
  after: idSchema,
});
