import type { APIRoute } from 'astro';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { Company } from '../../src/lib/server/companies/company.entity';
import type { Membership } from '../../src/lib/server/users/membership.entity';
import type { User } from '../../src/lib/server/users/user.entity';
import { callRoute } from './api-route';

export type StaffCaller = { company: Company; user: User; membership: Membership };

/**
 * Calls a staff API route in-process as a signed-in member of a firm would (the locals the session
 * middleware sets), with a real Request and the real database behind `locals.em`.
 */
export async function callAsStaff(
  handler: APIRoute,
  as: StaffCaller,
  call: { em: EntityManager; method: string; path: string; params?: Record<string, string>; body?: unknown },
): Promise<Response> {
  const membership = { id: as.membership.id, companyId: as.company.id, companyName: as.company.name, companySlug: as.company.slug, role: as.membership.role };
  const locals = {
    em: call.em,
    user: { id: as.user.id, email: as.user.email, name: as.user.name },
    session: { token: 'called-in-a-test', expiresAt: new Date(Date.now() + 3_600_000), absoluteExpiresAt: new Date(Date.now() + 3_600_000) },
    membership,
    memberships: [membership],
  };
  // callRoute builds the request and context; the signed-in parts are added to its locals.
  return callRoute(
    (context) => {
      Object.assign(context.locals, locals);
      return handler(context);
    },
    { method: call.method, path: call.path, params: call.params ?? {}, em: call.em, body: call.body },
  );
}
