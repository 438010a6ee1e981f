/// <reference path="../.astro/types.d.ts" />

declare namespace App {
  interface Locals {
    /** The request's own EntityManager (a fork, see middleware). */
    em: import('@mikro-orm/postgresql').EntityManager;
    /** The signed-in person, or null (see src/lib/server/auth/session-middleware.ts). */
    user: import('~/lib/server/auth/types').SignedInUser | null;
    /** The current session (its token stays on the server), or null. */
    session: import('~/lib/server/auth/types').CurrentSession | null;
    /** The firm the person is working in and their role there, or null. */
    membership: import('~/lib/server/auth/types').ActiveMembership | null;
    /** Every firm the person belongs to (for the firm switcher). */
    memberships: import('~/lib/server/auth/types').ActiveMembership[];
  }
}
