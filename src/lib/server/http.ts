import type { z } from 'zod';
import { fieldsFromZod } from '~/lib/estimate/errors.ts';
import { InvalidInput, PayloadTooLarge, UnsupportedMediaType } from './errors';

/** Largest JSON body an endpoint reads; bigger bodies are refused before parsing. */
const MAX_JSON_BYTES = 256 * 1024;

/**
 * Reads a body of at most `limit` bytes. A larger declared Content-Length is refused before any of it
 * is read, and a streamed (chunked) body is refused as soon as it passes the limit, so an oversized
 * body never sits in memory. (After the answer, scripts/serve.mjs discards what the client still sends.)
 */
export async function readLimitedBody(request: Request, limit: number, message: string): Promise<Uint8Array<ArrayBuffer>> {
  const declared = request.headers.get('content-length');
  if (declared !== null && !(Number(declared) <= limit)) throw new PayloadTooLarge(message);
  if (!request.body) return new Uint8Array(0);
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      size += value.byteLength;
      if (size > limit) throw new PayloadTooLarge(message);
      chunks.push(value);
    }
  } finally {
    // Stop here; whatever is left is not kept.
    reader.releaseLock();
  }
  const body = new Uint8Array(size);
  let offset = 0;
  for (const chunk of chunks) {
    body.set(chunk, offset);
    offset += chunk.byteLength;
  }
  return body;
}

/**
 * Reads a JSON request body and validates it with a zod schema. Refuses other content types (415),
 * oversized bodies (413), malformed JSON (400), and invalid fields (400 with a message per field).
 */
export async function readJson<S extends z.ZodType>(request: Request, schema: S): Promise<z.output<S>> {
  const type = request.headers.get('content-type') ?? '';
  if (!/^application\/json\b/i.test(type)) throw new UnsupportedMediaType();
  const text = new TextDecoder().decode(await readLimitedBody(request, MAX_JSON_BYTES, 'The request is too large.'));
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

const FORM_TOO_LARGE = 'The form is too large to read. Check what was typed and try again.';

/**
 * Reads a posted HTML form (urlencoded or multipart) as plain string fields, refusing oversized
 * bodies (413) before parsing them. Validate the result with `parseInput`.
 */
export async function readForm(request: Request): Promise<Record<string, string>> {
  const type = request.headers.get('content-type') ?? '';
  let entries: Iterable<[string, FormDataEntryValue]>;
  if (/^application\/x-www-form-urlencoded\b/i.test(type)) {
    const text = new TextDecoder().decode(await readLimitedBody(request, MAX_FORM_BYTES, FORM_TOO_LARGE));
    entries = new URLSearchParams(text).entries();
  } else if (/^multipart\/form-data\b/i.test(type)) {
    // Parsed from the bytes read within the limit, with the boundary from the original header.
    const body = await readLimitedBody(request, MAX_FORM_BYTES, FORM_TOO_LARGE);
    entries = (await new Response(body, { headers: { 'content-type': type } }).formData()).entries();
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
