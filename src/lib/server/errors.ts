import { RETRY_AFTER_SECONDS, isUnavailable } from './unavailable';
import { currentLog } from './log';

/**
 * The one error vocabulary of the server. Domain code throws these; `errorResponse()` maps them to a
 * status and the public JSON shape `{"error": "...", "fields": {"path": "message"}}`.
 */
export class AppError extends Error {
  /** More of the answer beside `error` and `fields` (a 409's open alternatives, say). */
  extra?: Record<string, unknown>;

  constructor(
    message: string,
    readonly status: number,
    readonly fields?: Record<string, string>,
    readonly headers?: Record<string, string>,
  ) {
    super(message);
    this.name = new.target.name;
  }
}

/** The input is wrong; `fields` names each bad field by its path (`rooms.0.walls.1.length`). */
export class InvalidInput extends AppError {
  constructor(message = 'Some fields need attention.', fields: Record<string, string> = {}) {
    super(message, 400, fields);
  }
}

export class Unauthenticated extends AppError {
  constructor(message = 'Please sign in.') {
    super(message, 401);
  }
}

/** Signed in, but this role may not do it. Never used for another firm's data: that is NotFound. */
export class Forbidden extends AppError {
  constructor(message = 'Your role does not allow this.') {
    super(message, 403);
  }
}

/** Missing, or belonging to another firm (the two look the same so ids are not confirmed). */
export class NotFound extends AppError {
  constructor(message = 'Not found.') {
    super(message, 404);
  }
}

export class Conflict extends AppError {
  constructor(message: string, fields?: Record<string, string>) {
    super(message, 409, fields);
  }
}

/** Well-formed but refused as it stands, e.g. an idempotency key reused with a different body. */
export class UnprocessableContent extends AppError {
  constructor(message: string, fields?: Record<string, string>) {
    super(message, 422, fields);
  }
}

/** The body is larger than the endpoint reads; the app reads no more of it (scripts/serve.mjs discards the rest). */
export class PayloadTooLarge extends AppError {
  constructor(message = 'The request is too large.') {
    super(message, 413);
  }
}

export class UnsupportedMediaType extends AppError {
  constructor(message = 'Send JSON (Content-Type: application/json).') {
    super(message, 415);
  }
}

export class TooManyRequests extends AppError {
  constructor(message: string, retryAfterSeconds: number) {
    super(message, 429, undefined, { 'Retry-After': String(Math.max(1, Math.ceil(retryAfterSeconds))) });
  }
}

/** A server we depend on (in practice the database) cannot be reached right now; try again shortly. */
export class ServiceUnavailable extends AppError {
  constructor(message = 'We cannot answer right now. Please try again in a moment.') {
    super(message, 503, undefined, { 'Retry-After': String(RETRY_AFTER_SECONDS) });
  }
}

/**
 * Maps any thrown value to a JSON response. An outage becomes a 503 with Retry-After (logged as a
 * warning); other unknown errors become a 500 with no detail, logged with the request's id.
 */
export function errorResponse(error: unknown, extraHeaders: Record<string, string> = {}): Response {
  if (!(error instanceof AppError) && isUnavailable(error)) {
    currentLog().warn({ err: error }, 'a server we depend on is unavailable; answered 503');
    error = new ServiceUnavailable();
  }
  if (error instanceof AppError) {
    const body: Record<string, unknown> & { error: string; fields?: Record<string, string> } = { ...error.extra, error: error.message };
    if (error.fields && Object.keys(error.fields).length) body.fields = error.fields;
    return Response.json(body, { status: error.status, headers: { ...error.headers, ...extraHeaders } });
  }
  currentLog().error({ err: error }, 'unexpected error; answered 500');
  return Response.json({ error: 'Something went wrong on our side. Please try again.' }, { status: 500, headers: extraHeaders });
}
