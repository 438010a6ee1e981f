import { defineMiddleware } from 'astro:middleware';
import { NotFound, errorResponse } from '../errors';
import { canonicalPath } from './paths';

const SAFE_METHODS = new Set(['GET', 'HEAD']);

/**
 * Runs before every guard: a path spelt any other way than its canonical form (`//app`, `/./app`,
 * `/%61pp`, `/app/../app`) never reaches them. Reading requests are sent to the canonical path,
 * where every guard applies; anything else is refused, so a write cannot slip past the CSRF rule.
 */
export const canonicalPaths = defineMiddleware((context, next) => {
  // The path as sent (the URL parser has already resolved `.`, `..` and `%2e` segments and turned
  // backslashes into slashes); Astro's `context.url` is a decoded copy of it.
  const sent = new URL(context.request.url).pathname;
  const canonical = canonicalPath(sent);
  if (canonical === sent) return next();
  if (SAFE_METHODS.has(context.request.method)) {
    return new Response(null, { status: 308, headers: { Location: canonical + context.url.search } });
  }
  return errorResponse(new NotFound('There is nothing at this address. Check the link and try again.'));
});
