import type { APIContext } from 'astro';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { Company } from '../companies/company.entity';
import { companyBySlug } from '../companies/company.repository';
import { AppError, errorResponse } from '../errors';
import { limiter, type LimiterOptions } from '../rate-limit';
import { corsHeaders, isForeignOrigin } from './cors';

export type PublicCall = { em: EntityManager; company: Company; request: Request; params: APIContext['params'] };
export type Limits = {
  perAddress: LimiterOptions;
  perFirm: LimiterOptions;
  /** What a refused caller reads; the defaults suit any widget call. */
  messages?: { perAddress?: string; perFirm?: string };
};

/**
 * Glue shared by the widget's public endpoints: finds the firm by slug, refuses origins the firm has
 * not allowed, applies the per-address and per-firm rate limits, adds CORS headers and maps errors
 * to the JSON error shape. The handler returns the JSON body and status.
 */
export function publicEndpoint(name: string, limits: Limits, handler: (call: PublicCall) => Promise<{ status: number; body?: unknown }>) {
  const perAddress = limiter(`${name}:address`, limits.perAddress);
  const perFirm = limiter(`${name}:firm`, limits.perFirm);
  return async (context: APIContext): Promise<Response> => {
    let cors: Record<string, string> = { Vary: 'Origin' };
    try {
      const company = await companyBySlug(context.locals.em, context.params.slug ?? '');
      cors = corsHeaders(context.request, company);
      if (isForeignOrigin(context.request, company)) throw new AppError('This site is not allowed to use the estimate form.', 403);
      await perAddress.consume(
        `${company.id}:${context.clientAddress}`,
        limits.messages?.perAddress ?? 'Too many requests from your network. Please wait a minute and try again.',
      );
      await perFirm.consume(company.id, limits.messages?.perFirm ?? 'This form is very busy right now. Please try again in a few minutes.');
      const { status, body } = await handler({ em: context.locals.em, company, request: context.request, params: context.params });
      return body === undefined ? new Response(null, { status, headers: cors }) : Response.json(body, { status, headers: cors });
    } catch (error) {
      return errorResponse(error, cors);
    }
  };
}

/** Answers CORS preflight requests for a public endpoint. */
export function preflight() {
  return async (context: APIContext): Promise<Response> => {
    try {
      const company = await companyBySlug(context.locals.em, context.params.slug ?? '');
      const headers = corsHeaders(context.request, company);
      return new Response(null, { status: headers['Access-Control-Allow-Origin'] ? 204 : 403, headers });
    } catch (error) {
      return errorResponse(error);
    }
  };
}
