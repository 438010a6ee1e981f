import type { APIContext, APIRoute } from 'astro';
import type { EntityManager } from '@mikro-orm/postgresql';

export type RouteCall = {
  method: string;
  path: string;
  params: Record<string, string>;
  em: EntityManager;
  body?: unknown;
  clientAddress?: string;
  headers?: Record<string, string>;
};

/**
 * Calls an Astro endpoint handler in-process with a real Request and the parts of the context our
 * endpoints read (params, locals.em, clientAddress, url). Responses are real Responses.
 */
export async function callRoute(handler: APIRoute, call: RouteCall): Promise<Response> {
  const url = new URL(call.path, 'http://127.0.0.1:4321');
  const request = new Request(url, {
    method: call.method,
    headers: { 'content-type': 'application/json', ...call.headers },
    body: call.body === undefined ? undefined : typeof call.body === 'string' ? call.body : JSON.stringify(call.body),
  });
  const context = {
    request,
    url,
    params: call.params,
    locals: { em: call.em },
    clientAddress: call.clientAddress ?? '192.0.2.10',
  } as unknown as APIContext;
  return handler(context);
}
