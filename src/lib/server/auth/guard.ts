import { Forbidden, Unauthenticated } from '../errors';
import type { Role } from '../users/membership.entity';
import type { ActiveMembership, SignedInUser } from './types';

/** Who is asking, in which firm, as what. Every staff page and staff API route starts from this. */
export type Staff = {
  user: SignedInUser;
  membership: ActiveMembership;
  companyId: string;
  role: Role;
  sessionToken: string;
};

/**
 * The one guard of the staff area. Throws Unauthenticated when no one is signed in to a firm and
 * Forbidden when `role` is given and the person's role in the active firm is another.
 * (Pages: the staff-area middleware turns these into a sign-in redirect or the "not allowed" page.
 * API routes: `staffEndpoint` turns them into 401/403 JSON.)
 */
export function requireStaff(locals: App.Locals, options: { role?: Role } = {}): Staff {
  const { user, membership, session } = locals;
  if (!user || !membership || !session) throw new Unauthenticated();
  if (options.role && membership.role !== options.role) throw new Forbidden('Only the firm’s owner can do this.');
  return { user, membership, companyId: membership.companyId, role: membership.role, sessionToken: session.token };
}
