import { describe, expect, test } from 'vitest';
import { z } from 'zod';
import { PayloadTooLarge } from './errors';
import { readForm, readJson } from './http';

const CHUNK = 64 * 1024;

/** A body of `chunks` chunks of 64 KiB that counts how often the reader asks for more. */
function countingBody(chunks: number, byte = 0x20) {
  const counter = { pulls: 0 };
  const stream = new ReadableStream<Uint8Array>({
    pull(controller) {
      counter.pulls++;
      if (counter.pulls > chunks) controller.close();
      else controller.enqueue(new Uint8Array(CHUNK).fill(byte));
    },
  });
  return { stream, counter };
}

function post(body: ReadableStream<Uint8Array> | string, headers: Record<string, string>): Request {
  return new Request('http://127.0.0.1:4321/api/x', { method: 'POST', body, headers, duplex: 'half' } as RequestInit);
}

const anything = z.unknown();

describe('readJson', () => {
  test('a declared Content-Length over 256 KiB is refused with 413 before any of the body is read', async () => {
    const { stream, counter } = countingBody(8000);
    const request = post(stream, { 'content-type': 'application/json', 'content-length': String(500 * 1024 * 1024) });
    await expect(readJson(request, anything)).rejects.toBeInstanceOf(PayloadTooLarge);
    // At most the one chunk a stream fills its queue with by itself; the reader asked for none.
    expect(counter.pulls).toBeLessThanOrEqual(1);
  });

  test('a streamed body with no Content-Length is refused with 413 once it passes 256 KiB, and read no further', async () => {
    // 16 MiB on offer; 256 KiB is four chunks, so the reader stops at the fifth.
    const { stream, counter } = countingBody(256);
    const request = post(stream, { 'content-type': 'application/json' });
    const refusal = await readJson(request, anything).catch((error: unknown) => error);
    expect(refusal).toBeInstanceOf(PayloadTooLarge);
    expect((refusal as PayloadTooLarge).status).toBe(413);
    // The fifth chunk, plus at most one the stream queued ahead (its high-water mark is one chunk).
    expect(counter.pulls).toBeLessThanOrEqual(6);
  });

  test('a body within the limit is read whole, declared or streamed', async () => {
    const json = JSON.stringify({ note: 'x'.repeat(200 * 1024) });
    await expect(readJson(post(json, { 'content-type': 'application/json' }), z.object({ note: z.string() }))).resolves.toEqual(JSON.parse(json));
    const { stream } = countingBody(3, 0x31); // "111…": a valid JSON number of 192 KiB digits
    await expect(readJson(post(stream, { 'content-type': 'application/json' }), anything)).resolves.toBeTypeOf('number');
  });

  test('the refusal maps to a 413 with the JSON error shape', async () => {
    const { errorResponse } = await import('./errors');
    const response = errorResponse(new PayloadTooLarge());
    expect(response.status).toBe(413);
    expect(await response.json()).toEqual({ error: 'The request is too large.' });
  });
});

describe('readForm', () => {
  test('a declared form over 32 KiB is refused with 413 before it is read', async () => {
    for (const type of ['application/x-www-form-urlencoded', 'multipart/form-data; boundary=x']) {
      const { stream, counter } = countingBody(8000);
      await expect(readForm(post(stream, { 'content-type': type, 'content-length': String(10 * 1024 * 1024) }))).rejects.toBeInstanceOf(PayloadTooLarge);
      expect(counter.pulls).toBeLessThanOrEqual(1);
    }
  });

  test('a streamed form is refused once it passes 32 KiB, for both encodings', async () => {
    for (const type of ['application/x-www-form-urlencoded', 'multipart/form-data; boundary=x']) {
      const { stream, counter } = countingBody(256);
      await expect(readForm(post(stream, { 'content-type': type }))).rejects.toBeInstanceOf(PayloadTooLarge);
      expect(counter.pulls).toBeLessThanOrEqual(3);
    }
  });

  test('small forms of both encodings are read', async () => {
    await expect(readForm(post('email=olive%40cedar-hollow.test&password=p', { 'content-type': 'application/x-www-form-urlencoded' }))).resolves.toEqual({
      email: 'olive@cedar-hollow.test',
      password: 'p',
    });
    const form = new FormData();
    form.append('email', 'sam@cedar-hollow.test');
    const multipart = new Request('http://127.0.0.1:4321/login', { method: 'POST', body: form });
    await expect(readForm(multipart)).resolves.toEqual({ email: 'sam@cedar-hollow.test' });
  });
});
