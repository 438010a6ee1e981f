import { afterEach, describe, expect, it, vi } from 'vitest';
import { alternativesOf, ApiError, getJson, postJson } from './api';

// Source: docs/sources.md §60 (WHATWG Fetch: an aborted fetch rejects; RFC 9110 §15.6: 5xx means
// the server failed, so asking again may succeed; a 4xx will not change on a retry).

const json = (status: number, body: unknown) => new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

/** A fetch that never answers until its signal aborts, as a stalled server does. */
const stalled = (_url: string | URL | Request, init?: RequestInit) =>
  new Promise<Response>((_, reject) => {
    init?.signal?.addEventListener('abort', () => reject(new DOMException('aborted', 'AbortError')));
  });

afterEach(() => {
  vi.useRealTimers();
});

describe('postJson', () => {
  it('gives up on a server that never answers, with a message that says so', async () => {
    vi.useFakeTimers();
    const fetchImpl = vi.fn(stalled);
    const pending = postJson('/x', {}, { timeoutMs: 8000, retries: 1, fetchImpl });
    const outcome = pending.catch((error: unknown) => error);
    await vi.advanceTimersByTimeAsync(8000);
    const error = await outcome;
    expect(error).toBeInstanceOf(ApiError);
    expect((error as ApiError).kind).toBe('timeout');
    expect((error as ApiError).retryable).toBe(true);
    expect((error as ApiError).message).toMatch(/taking too long/);
  });

  it('keeps its retry inside the same time limit, so a stall after a failure still ends on time', async () => {
    vi.useFakeTimers();
    const fetchImpl = vi
      .fn()
      .mockResolvedValueOnce(json(503, { error: 'Down' }))
      .mockImplementation(stalled);
    const outcome = postJson('/x', {}, { timeoutMs: 8000, retries: 1, fetchImpl }).catch((error: unknown) => error);
    await vi.advanceTimersByTimeAsync(8000);
    expect(await outcome).toBeInstanceOf(ApiError);
    expect(fetchImpl).toHaveBeenCalledTimes(2);
  });

  it('asks once more after a 5xx and returns the second answer', async () => {
    vi.useFakeTimers();
    const fetchImpl = vi
      .fn()
      .mockResolvedValueOnce(json(503, { error: 'Down' }))
      .mockResolvedValueOnce(json(200, { ok: 1 }));
    const outcome = postJson('/x', {}, { timeoutMs: 8000, retries: 1, fetchImpl });
    await vi.advanceTimersByTimeAsync(1000);
    expect(await outcome).toEqual({ ok: 1 });
    expect(fetchImpl).toHaveBeenCalledTimes(2);
  });

  it('asks once more after a network failure', async () => {
    vi.useFakeTimers();
    const fetchImpl = vi
      .fn()
      .mockRejectedValueOnce(new TypeError('Failed to fetch'))
      .mockResolvedValueOnce(json(200, { ok: 2 }));
    const outcome = postJson('/x', {}, { timeoutMs: 8000, retries: 1, fetchImpl });
    await vi.advanceTimersByTimeAsync(1000);
    expect(await outcome).toEqual({ ok: 2 });
  });

  it('reports a 5xx that persists as the server being unavailable, and retryable', async () => {
    vi.useFakeTimers();
    const fetchImpl = vi.fn().mockResolvedValue(json(503, { error: 'The service is busy.' }));
    const outcome = postJson('/x', {}, { timeoutMs: 8000, retries: 1, fetchImpl }).catch((error: unknown) => error);
    await vi.advanceTimersByTimeAsync(1000);
    const error = (await outcome) as ApiError;
    expect(fetchImpl).toHaveBeenCalledTimes(2);
    expect(error.status).toBe(503);
    expect(error.kind).toBe('server');
    expect(error.retryable).toBe(true);
  });

  it('never retries a 4xx: the same answers would be refused again', async () => {
    const fetchImpl = vi.fn().mockResolvedValue(json(400, { error: 'Check', fields: { 'project.rooms.0.length': 'Too long' } }));
    const error = (await postJson('/x', {}, { timeoutMs: 8000, retries: 1, fetchImpl }).catch((e: unknown) => e)) as ApiError;
    expect(fetchImpl).toHaveBeenCalledTimes(1);
    expect(error.kind).toBe('input');
    expect(error.retryable).toBe(false);
    expect(error.fields).toEqual({ 'project.rooms.0.length': 'Too long' });
  });

  it('makes no automatic retry when told not to (sending an inquiry)', async () => {
    const fetchImpl = vi.fn().mockResolvedValue(json(502, {}));
    const error = (await postJson('/x', {}, { timeoutMs: 20000, retries: 0, fetchImpl }).catch((e: unknown) => e)) as ApiError;
    expect(fetchImpl).toHaveBeenCalledTimes(1);
    expect(error.retryable).toBe(true);
  });

  it('keeps the rest of an error answer, so a 409 can offer its other open times', async () => {
    const alternatives = [{ start: '2027-01-05T16:30:00.000Z', end: '2027-01-05T17:30:00.000Z' }];
    const fetchImpl = vi.fn().mockResolvedValue(json(409, { error: 'Taken', fields: { start: 'Taken' }, alternatives }));
    const error = (await postJson('/x', {}, { timeoutMs: 20000, retries: 0, fetchImpl }).catch((e: unknown) => e)) as ApiError;
    expect(error.status).toBe(409);
    expect(alternativesOf(error)).toEqual(alternatives);
    expect(alternativesOf(new ApiError('Down', 503))).toEqual([]);
  });
});

describe('getJson', () => {
  it('sends a GET with no body, and retries it within the same time limit', async () => {
    vi.useFakeTimers();
    const fetchImpl = vi
      .fn()
      .mockRejectedValueOnce(new TypeError('Failed to fetch'))
      .mockResolvedValueOnce(json(200, { slots: [] }));
    const outcome = getJson('/x?lead=1', { timeoutMs: 8000, retries: 1, fetchImpl });
    await vi.advanceTimersByTimeAsync(1000);
    expect(await outcome).toEqual({ slots: [] });
    expect(fetchImpl).toHaveBeenLastCalledWith('/x?lead=1', expect.objectContaining({ method: 'GET' }));
    expect(fetchImpl.mock.lastCall?.[1]).not.toHaveProperty('body');
  });

  it('gives up on a server that never answers', async () => {
    vi.useFakeTimers();
    const outcome = getJson('/x', { timeoutMs: 8000, retries: 1, fetchImpl: vi.fn(stalled) }).catch((error: unknown) => error);
    await vi.advanceTimersByTimeAsync(8000);
    expect(((await outcome) as ApiError).kind).toBe('timeout');
  });
});
