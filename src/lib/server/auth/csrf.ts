import { defineMiddleware } from 'astro:middleware';
import { config } from '../config';
import { needsSameOrigin } from './paths';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Refuses any request that changes something in the staff area unless it comes from our own pages,
 * whatever its content type. Astro's own origin check covers only form content types; JSON calls
 * would pass it.
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
  const fetchSite = request.headers.get('sec-fetch-site');
  const origin = request.headers.get('origin');
  const ours = origin !== null && (origin === config.publicOrigin || origin === url.origin);
  if ((fetchSite && fetchSite !== 'same-origin' && fetchSite !== 'none') || !ours) {
    return Response.json({ error: 'This request did not come from a Lapwing page, so it was refused. Reload the page and try again.' }, { status: 403 });
  }
  return next();
});
