import { Forbidden, NotFound, Unauthenticated } from '../errors';
import type { FirmScoped, ObjectPolicy, Viewer } from '../viewer';
import type { ActiveMembership, SignedInUser } from './types';

/** Who is asking, in which firm, as what. Every staff page and staff API route starts from this. */
export type Staff = Viewer & {
  user: SignedInUser;
  membership: ActiveMembership;
  sessionToken: string;
};

/** A policy about the viewer alone (`canManageTeam`, `canUseSetup`, …), for the guard's `may`. */
export type ViewerPolicy = (viewer: Viewer) => boolean;

export type StaffGuardOptions = {
  may?: ViewerPolicy;
  /**
   * Answer a refused role as if the page or route did not exist (404), for the owner's own areas
   * (Rate book, Setup, Reports): a salesperson is not told that they are there.
   */
  hidden?: boolean;
};

/**
 * The one guard of the staff area. Throws Unauthenticated when no one is signed in to a firm and
 * Forbidden (NotFound with `hidden`) when the policy `may` refuses the person as they are in the active firm.
 * (Pages: the staff-area middleware turns these into a sign-in redirect or the "not allowed" page.
 * API routes: `staffEndpoint` turns them into 401/403 JSON.)
 *
 *   const staff = requireStaff(Astro.locals, { may: canManageTeam });
 */
export function requireStaff(locals: App.Locals, options: StaffGuardOptions = {}): Staff {
  const { user, membership, session } = locals;
  if (!user || !membership || !session) throw new Unauthenticated();
  const staff: Staff = {
    user,
    membership,
    userId: user.id,
    companyId: membership.companyId,
    role: membership.role,
    sessionToken: session.token,
  };
  if (options.may && !options.may(staff)) throw options.hidden ? new NotFound() : new Forbidden();
  return staff;
}

/**
 * Checks a policy about one object. Another firm's object is NotFound, so its id is not confirmed;
 * one of the firm's own that the role may not touch is Forbidden.
 *
 *   authorize(staff, canSeeLead, lead);
 */
export function authorize<T extends FirmScoped>(viewer: Viewer, policy: ObjectPolicy<T>, target: T): void {
  if (target.company.id !== viewer.companyId) throw new NotFound();
  if (!policy(viewer, target)) throw new Forbidden();
}
