import type { z } from 'zod';
import { fieldsFromZod } from '~/lib/estimate/errors.ts';
import { InvalidInput, UnsupportedMediaType } from './errors';

/** Largest JSON body an endpoint reads; bigger bodies are refused before parsing. */
const MAX_JSON_BYTES = 256 * 1024;

/**
 * Reads a JSON request body and validates it with a zod schema. Refuses other content types (415),
 * oversized bodies and malformed JSON (400), and invalid fields (400 with a message per field).
 */
export async function readJson<S extends z.ZodType>(request: Request, schema: S): Promise<z.output<S>> {
  const type = request.headers.get('content-type') ?? '';
  if (!/^application\/json\b/i.test(type)) throw new UnsupportedMediaType();
  const text = await request.text();
  if (text.length > MAX_JSON_BYTES) throw new InvalidInput('The request is too large.');
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch {
    throw new InvalidInput('The request body is not valid JSON.');
  }
  const parsed = schema.safeParse(data);
  if (!parsed.success) throw new InvalidInput('Some fields need attention.', fieldsFromZod(parsed.error));
  return parsed.data;
}

/** Largest HTML form body a page reads (sign-in, invitations, team); far above any honest form. */
const MAX_FORM_BYTES = 32 * 1024;

/**
 * Reads a posted HTML form (urlencoded or multipart) as plain string fields, refusing oversized
 * bodies before parsing them. Validate the result with `parseInput`.
 */
export async function readForm(request: Request): Promise<Record<string, string>> {
  const declared = Number(request.headers.get('content-length') ?? '0');
  if (declared > MAX_FORM_BYTES) throw new InvalidInput('The form is too large to read. Check what was typed and try again.');
  const type = request.headers.get('content-type') ?? '';
  let entries: Iterable<[string, FormDataEntryValue]>;
  if (/^application\/x-www-form-urlencoded\b/i.test(type)) {
    const text = await request.text();
    if (text.length > MAX_FORM_BYTES) throw new InvalidInput('The form is too large to read. Check what was typed and try again.');
    entries = new URLSearchParams(text).entries();
  } else if (/^multipart\/form-data\b/i.test(type) && declared > 0) {
    entries = (await request.formData()).entries();
  } else {
    throw new UnsupportedMediaType('Send the form as application/x-www-form-urlencoded.');
  }
  const fields: Record<string, string> = {};
  for (const [name, value] of entries) if (typeof value === 'string') fields[name] = value;
  return fields;
}

/** Validates already-read input with a zod schema; invalid fields become one InvalidInput. */
export function parseInput<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  const parsed = schema.safeParse(input);
  if (!parsed.success) throw new InvalidInput('Some fields need attention.', fieldsFromZod(parsed.error));
  return parsed.data;
}
