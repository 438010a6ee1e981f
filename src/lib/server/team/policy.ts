import { roleInFirm, type FirmScoped, type Viewer } from '../viewer';

/** Invite people, change roles, remove members, withdraw invitations: the owner only. */
export const canManageTeam = (viewer: Viewer, target?: FirmScoped): boolean => roleInFirm(viewer, ['owner'], target);
