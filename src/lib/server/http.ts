import type { z } from 'zod';
import { InvalidInput, UnsupportedMediaType, fieldsFromZod } from './errors';

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
  if (!parsed.success) throw new InvalidInput('Some fields need attention.', fieldsFromZod(parsed.error.issues));
  return parsed.data;
}
