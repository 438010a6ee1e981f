import type { StaffRole } from './labels';

// What each role may do, as pure functions: the staff shell uses them to decide which links to
// show; the server enforces roles with `requireStaff(locals, { role })`. Shared, so a layout or an
// island can ask without importing server code.

export const canManageTeam = (role: StaffRole): boolean => role === 'owner';
export const canUseRateBook = (role: StaffRole): boolean => role === 'owner';
export const canUseSetup = (role: StaffRole): boolean => role === 'owner';
