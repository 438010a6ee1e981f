import { defineMiddleware, sequence } from 'astro:middleware';
import { RequestContext } from '@mikro-orm/core';
import { getOrm } from '~/lib/server/boot/orm';
import type { EntityManager } from '@mikro-orm/postgresql';
import { csrf } from '~/lib/server/auth/csrf';
import { session } from '~/lib/server/auth/session-middleware';
import { staffArea } from '~/lib/server/auth/staff-area';
import { canonicalPaths } from '~/lib/server/auth/canonical-path';
import { config } from '~/lib/server/config';
import { STRICT_TRANSPORT_SECURITY, completePolicy, mayBeFramed, mustNotBeStored } from '~/lib/server/security-headers';
import { requestLog } from '~/lib/server/request-log';
import { failures } from '~/lib/server/failures';

/** Gives every request its own EntityManager; the global one is never used for request work. */
const requestContext = defineMiddleware(async (context, next) => {
  const orm = await getOrm();
  return RequestContext.create(orm.em, () => {
    context.locals.em = RequestContext.getEntityManager() as EntityManager;
    return next();
  });
});

/** Headers every response gets (see security-headers.ts). Only the widget's embed pages may be framed. */
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
  // A page may ask for a stricter one (the homeowner's private link sends none at all).
  if (!headers.has('Referrer-Policy')) headers.set('Referrer-Policy', 'strict-origin-when-cross-origin');
  headers.set('Permissions-Policy', 'camera=(), microphone=(), geolocation=()');
  const html = (headers.get('Content-Type') ?? '').startsWith('text/html');
  const policy = completePolicy(headers.get('Content-Security-Policy'), { html, dev: import.meta.env.DEV });
  headers.set('Content-Security-Policy', policy);
  if (!mayBeFramed(policy)) headers.set('X-Frame-Options', 'DENY');
  if (config.servedOverHttps) headers.set('Strict-Transport-Security', STRICT_TRANSPORT_SECURITY);
  if (mustNotBeStored(context.url.pathname)) headers.set('Cache-Control', 'no-store');
  return response;
});

// Order matters: the request id and log first, so every later step logs with it; every answer gets
// the security headers; `failures` turns whatever is thrown below it (a database outage included,
// even while the ORM starts) into an answer; then refuse other spellings of a path before any guard
// reads it, refuse cross-site writes, find the session, and guard /app.
export const onRequest = sequence(requestLog, securityHeaders, failures, requestContext, canonicalPaths, csrf, session, staffArea);
