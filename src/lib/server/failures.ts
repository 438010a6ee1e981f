import { defineMiddleware } from 'astro:middleware';
import { isUnavailable, RETRY_AFTER_SECONDS } from './unavailable';
import { AppError, errorResponse } from './errors';
import { currentLog } from './log';

/** A page of its own that needs nothing else to render: no layout, no database, no script. */
function plainPage(status: number, title: string, message: string, headers: Record<string, string> = {}): Response {
  const html = `<!doctype html>
<html lang="en">
<head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>${title}</title></head>
<body style="font-family: system-ui, sans-serif; max-width: 36rem; margin: 4rem auto; padding: 0 1.5rem; line-height: 1.5; color: #1f2933">
<h1 style="font-size: 1.5rem">${title}</h1>
<p>${message}</p>
</body>
</html>
`;
  return new Response(html, { status, headers: { 'Content-Type': 'text/html; charset=utf-8', 'Cache-Control': 'no-store', ...headers } });
}

const escapeHtml = (text: string) => text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

/**
 * The last word on anything a route throws. API paths answer the JSON error shape through
 * `errorResponse`. Pages answer a plain page: 503 with Retry-After when the database cannot be
 * reached (the app stays up and carries on once it is back), the error's own status for an
 * AppError, and a logged 500 for anything else. Astro's dev server keeps its own error overlay.
 */
export const failures = defineMiddleware(async (context, next) => {
  try {
    return await next();
  } catch (error) {
    if (context.url.pathname.startsWith('/api/')) return errorResponse(error);
    if (!(error instanceof AppError) && isUnavailable(error)) {
      currentLog().warn({ err: error }, 'a server we depend on is unavailable; answered 503');
      return plainPage(503, 'Back in a moment', 'This page cannot be shown right now. Please try again in a minute.', {
        'Retry-After': String(RETRY_AFTER_SECONDS),
      });
    }
    if (error instanceof AppError) return plainPage(error.status, 'This did not work', escapeHtml(error.message), error.headers);
    if (import.meta.env.DEV) throw error;
    currentLog().error({ err: error }, 'unexpected error; answered 500');
    return plainPage(500, 'Something went wrong', 'Something went wrong on our side. Please try again.');
  }
});
