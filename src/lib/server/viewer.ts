/**
 * Who is looking, for the permission policies beside each domain (`leads/policy.ts`,
 * `rates/policy.ts`, `team/policy.ts`, `companies/policy.ts`). Policies are pure functions of a
 * viewer and, where it matters, the object; they never query. Ground floor: imports no domain.
 */
import type { StaffRole } from '~/lib/shared/labels';

/** A signed-in person in their active firm. `Staff` from the guard is one. */
export type Viewer = { userId: string; companyId: string; role: StaffRole };

/** Anything a firm owns, as its entity carries it (every `TenantEntity` is one). */
export type FirmScoped = { company: { id: string } };

/** A rule about the viewer alone, or about the viewer and one object of a firm. */
export type FirmPolicy = (viewer: Viewer, target?: FirmScoped) => boolean;
export type ObjectPolicy<T extends FirmScoped = FirmScoped> = (viewer: Viewer, target: T) => boolean;

/**
 * The shape every policy starts from: the object (if any) is in the viewer's active firm, and the
 * viewer's role is one of `roles`. Anything else, an unknown role included, is refused.
 */
export function roleInFirm(viewer: Viewer, roles: readonly StaffRole[], target?: FirmScoped): boolean {
  if (target && target.company.id !== viewer.companyId) return false;
  return roles.includes(viewer.role);
}

/**
 * Presents what the viewer may do with one object as a map of plain booleans, for islands to
 * decide which controls to offer (the server still checks each action when it is asked).
 */
export function allowedActions<T extends FirmScoped, K extends string>(viewer: Viewer, target: T, policies: Record<K, ObjectPolicy<T>>): Record<K, boolean> {
  const actions = {} as Record<K, boolean>;
  for (const action of Object.keys(policies) as K[]) actions[action] = policies[action](viewer, target);
  return actions;
}
