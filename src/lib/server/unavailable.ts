/**
 * Tells an outage (the database, or another server we connect to, cannot be reached right now)
 * from a fault in our code. An outage is answered 503 with Retry-After and the app carries on;
 * the connection pool reconnects by itself once the server is back.
 */

/** Seconds a client is asked to wait before trying again during an outage (a restart takes a few). */
export const RETRY_AFTER_SECONDS = 5;

// Source: PostgreSQL 15 manual, Appendix A "PostgreSQL Error Codes": class 08 is "Connection
// Exception"; 57P01 admin_shutdown, 57P02 crash_shutdown, 57P03 cannot_connect_now; 53300
// too_many_connections.
const SERVER_CODES = new Set(['57P01', '57P02', '57P03', '53300']);
const CONNECTION_CLASS = '08';

// Node's socket errors when the server is down, restarting or unreachable (Node.js docs, "Common system errors").
const SOCKET_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'EPIPE', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENETUNREACH', 'EAI_AGAIN']);

// What node-postgres and knex say when a connection is lost or none can be had; these errors carry no code.
const LOST_CONNECTION = [/^Connection terminated/, /^Client has encountered a connection error and is not queryable/, /^Knex: Timeout acquiring a connection/];

function isOutageItself(error: unknown): boolean {
  if (!error || typeof error !== 'object') return false;
  const code = (error as { code?: unknown }).code;
  if (typeof code === 'string' && (SERVER_CODES.has(code) || SOCKET_CODES.has(code) || (code.length === 5 && code.startsWith(CONNECTION_CLASS)))) return true;
  const message = (error as { message?: unknown }).message;
  return typeof message === 'string' && LOST_CONNECTION.some((pattern) => pattern.test(message));
}

/** True when `error`, or an error it wraps, says a server we depend on is unavailable. */
export function isUnavailable(error: unknown, depth = 0): boolean {
  if (depth > 5 || !error || typeof error !== 'object') return false;
  if (isOutageItself(error)) return true;
  const { cause, errors } = error as { cause?: unknown; errors?: unknown };
  if (isUnavailable(cause, depth + 1)) return true;
  return Array.isArray(errors) && errors.some((inner) => isUnavailable(inner, depth + 1));
}
