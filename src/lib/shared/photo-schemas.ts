/**
 * Photo limits and the inputs of the widget's photo endpoints, shared by the photo picker and the
 * server so the browser refuses exactly what the server would.
 */
import { z } from 'zod';

/** Photos per widget draft (issue 5). */
export const MAX_PHOTOS = 10;

/** Largest file we accept, before or after the browser shrinks it (issue 5: 15 MB). */
export const MAX_PHOTO_BYTES = 15 * 1024 * 1024;

/** Photos are shrunk to this long edge, in the browser before upload and again on the server. */
export const PHOTO_LONG_EDGE_PX = 2000;

/** The formats the server can read and re-encode; everything else is refused. */
export const ACCEPTED_PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const;

export const PHOTO_MESSAGES = {
  notAPhoto: "This file isn't a photo we can use. JPEG, PNG or WebP, please.",
  tooBig: 'This photo is over 15 MB. Please pick a smaller one.',
  tooMany: `You can add up to ${MAX_PHOTOS} photos.`,
} as const;

const formToken = z.string({ error: 'The form token is missing; reload the page.' }).min(10).max(600);

/** Body of POST /api/embed/SLUG/photos: what the browser is about to upload. */
export const photoUploadRequestSchema = z.strictObject({
  formToken,
  /** The homeowner's file name, shown back to them only; storage keys never use it. */
  name: z.string({ error: 'The file name is missing.' }).max(1000, { error: 'The file name is too long.' }).transform(displayName),
  size: z
    .number({ error: 'The file size is missing.' })
    .int({ error: 'The file size must be a whole number of bytes.' })
    .min(1, { error: 'This file is empty.' })
    .max(MAX_PHOTO_BYTES, { error: PHOTO_MESSAGES.tooBig }),
  type: z
    .string({ error: 'The file type is missing.' })
    .max(100)
    .regex(/^image\/[a-z0-9.+-]+$/i, { error: PHOTO_MESSAGES.notAPhoto }),
});

export type PhotoUploadRequest = z.input<typeof photoUploadRequestSchema>;

/** Body of POST …/photos/ID/complete and DELETE …/photos/ID. */
export const photoFormTokenSchema = z.strictObject({ formToken });

/**
 * A file name fit for display: no folders, no control characters, at most 120 characters
 * (the column width), never empty.
 */
export function displayName(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? '';
  // eslint-disable-next-line no-control-regex
  const clean = base.replace(/[\u0000-\u001f\u007f]/g, '').trim();
  return Array.from(clean).slice(0, 120).join('') || 'photo';
}
