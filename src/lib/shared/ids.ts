import { z } from 'zod';

/**
 * Row ids are UUIDs. Anything else in a URL or a form cannot name a row, and must never reach a
 * uuid column (PostgreSQL would refuse it with an error, not an empty result). Every lookup by id
 * checks the shape first and treats a malformed id as not found.
 */
const UUID_SHAPE = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export const idSchema = z.string().regex(UUID_SHAPE, { error: 'Not a valid id.' });

export function isId(value: unknown): value is string {
  return typeof value === 'string' && UUID_SHAPE.test(value);
}
