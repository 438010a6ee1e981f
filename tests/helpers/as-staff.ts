/**
 * Calls a staff API route in-process as a signed-in member of a firm: the real handler (guard,
 * policies, zod, errors) with the locals the session middleware would have set, and a real
 * PostgreSQL behind `locals.em`.
 */
import type { APIContext, APIRoute } from 'astro';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { Company } from '../../src/lib/server/companies/company.entity';
import type { Membership } from '../../src/lib/server/users/membership.entity';
import type { User } from '../../src/lib/server/users/user.entity';

export type StaffCaller = { company: Company; user: User; membership: Membership };

export async function callAsStaff(
  handler: APIRoute,
  as: StaffCaller | null,
  call: { em: EntityManager; method: string; path: string; params?: Record<string, string>; body?: unknown; contentType?: string },
): Promise<Response> {
  const url = new URL(call.path, 'http://127.0.0.1:4321');
  const request = new Request(url, {
    method: call.method,
    headers: { 'content-type': call.contentType ?? 'application/json' },
    body: call.body === undefined ? undefined : typeof call.body === 'string' ? call.body : JSON.stringify(call.body),
  });
  const membership = as && {
    id: as.membership.id,
    companyId: as.company.id,
    companyName: as.company.name,
    companySlug: as.company.slug,
    role: as.membership.role,
  };
  const locals = as
    ? {
        em: call.em,
        user: { id: as.user.id, email: as.user.email, name: as.user.name },
        session: { token: 'called-in-a-test', expiresAt: new Date(Date.now() + 3_600_000), absoluteExpiresAt: new Date(Date.now() + 3_600_000) },
        membership,
        memberships: [membership],
      }
    : { em: call.em };
  return handler({ request, url, params: call.params ?? {}, locals, clientAddress: '192.0.2.10' } as unknown as APIContext);
}
