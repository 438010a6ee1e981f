import type { APIContext } from 'astro';
import type { EntityManager } from '@mikro-orm/postgresql';
import { comesFromOurPages, NOT_FROM_OUR_PAGES } from '../auth/same-origin';
import { AppError, errorResponse } from '../errors';
import { limiter } from '../rate-limit';
import { visitIdOfToken } from './visit-link';

export type LinkCall = { em: EntityManager; token: string; request: Request };

/**
 * Glue for the routes of the homeowner's visit link (`/api/visit/TOKEN/…`): only our own page may
 * call them (the same Origin and Fetch Metadata rule as the staff area, checked here as well as in
 * the middleware), each caller's address and each visit get a few calls, and every failure is the
 * JSON error shape. The handler returns the JSON body and status.
 */
export function linkEndpoint(name: string, handler: (call: LinkCall) => Promise<{ status: number; body: unknown }>) {
  // A person moves or cancels a visit a few times at most; these leave room for mistakes and retries.
  const perAddress = limiter(`${name}:address`, { points: 30, duration: 600 });
  const perVisit = limiter(`${name}:visit`, { points: 10, duration: 3600 });
  return async (context: APIContext): Promise<Response> => {
    try {
      if (!comesFromOurPages(context.request, context.url)) throw new AppError(NOT_FROM_OUR_PAGES, 403);
      await perAddress.consume(context.clientAddress, 'Too many requests from your network. Please wait a few minutes and try again.');
      const token = context.params.token ?? '';
      // Counted per visit only for a real link, so forged ones cannot use up a homeowner's calls.
      const visitId = visitIdOfToken(token);
      if (visitId) await perVisit.consume(visitId, 'This visit has been changed many times in the last hour. Please call the firm instead.');
      const { status, body } = await handler({ em: context.locals.em, token, request: context.request });
      return Response.json(body, { status });
    } catch (error) {
      return errorResponse(error);
    }
  };
}
