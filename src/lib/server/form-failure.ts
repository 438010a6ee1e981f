import { AppError, InvalidInput } from './errors';

export type FormFailure = { status: number; headers: Record<string, string>; fields: Record<string, string>; problem: string | null };

/**
 * What a server-rendered form shows after a refused post: the status (and headers, such as
 * Retry-After) to answer with, a message per field, and a message for the whole form when no field
 * is to blame; a field-level message is enough on its own. Unknown errors are rethrown.
 */
export function formFailure(error: unknown): FormFailure {
  if (!(error instanceof AppError)) throw error;
  const fields = error.fields ?? {};
  const problem = error instanceof InvalidInput && Object.keys(fields).length ? null : error.message;
  return { status: error.status, headers: error.headers ?? {}, fields, problem };
}
