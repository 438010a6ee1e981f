import { defineMiddleware } from 'astro:middleware';
import { currentLog, withRequestLog } from './log';
import { requestIdFor } from './request-id';

/**
 * Gives every request an id (the caller's plain `X-Request-Id`, or a new one), runs it with a log
 * that carries the id, echoes the id in the response and logs one line when it is answered.
 * Only the path is logged: query strings can hold private keys (the homeowner's estimate link).
 */
export const requestLog = defineMiddleware((context, next) => {
  const requestId = requestIdFor(context.request.headers.get('x-request-id'));
  return withRequestLog(requestId, async () => {
    const started = performance.now();
    let response = await next();
    try {
      response.headers.set('X-Request-Id', requestId);
    } catch {
      // Responses such as Response.redirect() have immutable headers; copy them once.
      response = new Response(response.body, response);
      response.headers.set('X-Request-Id', requestId);
    }
    currentLog().info(
      { method: context.request.method, path: context.url.pathname, status: response.status, ms: Math.round(performance.now() - started) },
      'request answered',
    );
    return response;
  });
});
