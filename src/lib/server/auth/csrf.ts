import { defineMiddleware } from 'astro:middleware';
import { needsSameOrigin } from './paths';
import { comesFromOurPages, NOT_FROM_OUR_PAGES } from './same-origin';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Refuses any request that changes something in the staff area (or through the homeowner's visit
 * link) unless it comes from our own pages, whatever its content type. Astro's own origin check
 * covers only form content types; JSON calls would pass it.
 *
 * Rule (Source: OWASP CSRF Prevention Cheat Sheet, "Fetch Metadata" and "Verifying Origin With
 * Standard Headers"; the same order as Go 1.25's CrossOriginProtection):
 *   1. `Sec-Fetch-Site`, when sent, must be `same-origin` (or `none`: typed by the person).
 *   2. `Origin` must be sent and be our origin. Browsers send it with every POST, PUT, PATCH and
 *      DELETE; a request without it is not from a page of ours.
 */
export const csrf = defineMiddleware((context, next) => {
  const { request, url } = context;
  if (SAFE_METHODS.has(request.method) || !needsSameOrigin(url.pathname)) return next();
  if (!comesFromOurPages(request, url)) return Response.json({ error: NOT_FROM_OUR_PAGES }, { status: 403 });
  return next();
});
