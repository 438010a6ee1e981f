import { defineMiddleware } from 'astro:middleware';
import { AppError, Forbidden, NotFound, Unauthenticated, errorResponse } from '../errors';
import { isStaffApiPath, isStaffPagePath } from './paths';

function signInRedirect(url: URL): Response {
  return new Response(null, { status: 302, headers: { Location: `/login?next=${encodeURIComponent(url.pathname + url.search)}` } });
}

function appErrorOf(error: unknown): AppError | null {
  if (error instanceof AppError) return error;
  if (error instanceof Error && error.cause instanceof AppError) return error.cause;
  return null;
}

/**
 * Deny by default: nothing under /app or /api/app runs for someone who is not signed in to a firm,
 * even if a route forgot its guard. For pages it also turns the guard's refusals into answers a
 * person can read: sign in, "not allowed" (403) or not found (404, also for another firm's ids).
 */
export const staffArea = defineMiddleware(async (context, next) => {
  const { pathname } = context.url;
  const page = isStaffPagePath(pathname);
  if (!page && !isStaffApiPath(pathname)) return next();
  const signedIn = Boolean(context.locals.user && context.locals.membership);
  if (!page) return signedIn ? next() : errorResponse(new Unauthenticated());
  if (!signedIn) return signInRedirect(context.url);
  try {
    return await next();
  } catch (thrown) {
    const error = appErrorOf(thrown);
    if (error instanceof Unauthenticated) return signInRedirect(context.url);
    if (error instanceof Forbidden) return context.rewrite('/not-allowed');
    // An empty 404 lets Astro show the site's not-found page.
    if (error instanceof NotFound) return new Response(null, { status: 404 });
    throw thrown;
  }
});
