import type { Role } from '../users/membership.entity';

// What each role may do, as pure functions: the guard enforces them on the server, the shell uses
// them to decide which links to show.

export const canManageTeam = (role: Role): boolean => role === 'owner';
export const canUseRateBook = (role: Role): boolean => role === 'owner';
export const canUseSetup = (role: Role): boolean => role === 'owner';
