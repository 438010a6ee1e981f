import type { z } from 'zod';

/**
 * Bad input to the estimate: `fields` maps a path such as `rooms.0.walls.1.openings.0.width` to a
 * message a person can act on. The API answers `{ error: message, fields }` with a 4xx status.
 */
export class EstimateInputError extends Error {
  readonly fields: Record<string, string>;
  constructor(fields: Record<string, string>, message = 'Some of the answers need another look.') {
    super(message);
    this.name = 'EstimateInputError';
    this.fields = fields;
  }
}

/** Turns zod issues into a field map; `prefix` names the input (e.g. `rateBook`) when several are checked. */
export function fieldsFromZod(error: z.ZodError, prefix = ''): Record<string, string> {
  const fields: Record<string, string> = {};
  const put = (path: PropertyKey[], message: string): void => {
    const key = [prefix, ...path.map(String)].filter((p) => p !== '').join('.') || '(input)';
    if (!(key in fields)) fields[key] = message;
  };
  for (const issue of error.issues) {
    if (issue.code === 'unrecognized_keys') {
      for (const k of issue.keys) put([...issue.path, k], `Unknown field "${k}"; remove it.`);
    } else {
      put(issue.path, issue.message);
    }
  }
  return fields;
}
