import { defineMiddleware, sequence } from 'astro:middleware';
import { RequestContext } from '@mikro-orm/core';
import { getOrm } from './lib/server/db/orm';
import { startMailWorker } from './lib/server/mail/worker';
import type { EntityManager } from '@mikro-orm/postgresql';
import { csrf } from './lib/server/auth/csrf';
import { session } from './lib/server/auth/session-middleware';
import { staffArea } from './lib/server/auth/staff-area';
import { requestLog } from './lib/server/request-log';
import { failures } from './lib/server/failures';

/** Gives every request its own EntityManager; the global one is never used for request work. */
const requestContext = defineMiddleware(async (context, next) => {
  const orm = await getOrm();
  startMailWorker(orm);
  return RequestContext.create(orm.em, () => {
    context.locals.em = RequestContext.getEntityManager() as EntityManager;
    return next();
  });
});

/** Headers every response gets. Only the widget's embed pages may be framed (they set their own). */
const securityHeaders = defineMiddleware(async (context, next) => {
  let response = await next();
  try {
    response.headers.set('X-Content-Type-Options', 'nosniff');
  } catch {
    // Responses such as Response.redirect() have immutable headers; copy them once.
    response = new Response(response.body, response);
  }
  const headers = response.headers;
  headers.set('X-Content-Type-Options', 'nosniff');
  headers.set('Referrer-Policy', 'strict-origin-when-cross-origin');
  headers.set('Permissions-Policy', 'camera=(), microphone=(), geolocation=()');
  if (!headers.has('Content-Security-Policy')) {
    headers.set('Content-Security-Policy', "frame-ancestors 'none'; object-src 'none'; base-uri 'self'");
    headers.set('X-Frame-Options', 'DENY');
  }
  if (context.url.pathname.startsWith('/app') || context.url.pathname.startsWith('/api/')) {
    headers.set('Cache-Control', 'no-store');
  }
  return response;
});

// Order matters: the request id and log first, so every later step logs with it; every answer gets
// the security headers; `failures` turns whatever is thrown below it (a database outage included,
// even while the ORM starts) into an answer; then refuse cross-site writes before any work, find
// the session, and guard /app.
export const onRequest = sequence(requestLog, securityHeaders, failures, requestContext, csrf, session, staffArea);
