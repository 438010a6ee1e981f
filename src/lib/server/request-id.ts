import { randomUUID } from 'node:crypto';

/** Short, plain ids only: a caller's value ends up in log lines and a response header. */
const ACCEPTABLE = /^[A-Za-z0-9._:-]{1,128}$/;

/**
 * The id of one request: the caller's `X-Request-Id` when it is plain (a proxy in front may have set
 * one, and its logs then match ours), otherwise a new random one.
 */
export function requestIdFor(incoming: string | null): string {
  return incoming && ACCEPTABLE.test(incoming) ? incoming : randomUUID();
}
