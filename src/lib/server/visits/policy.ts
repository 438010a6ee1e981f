import { roleInFirm, type FirmScoped, type Viewer } from '../viewer';

// Sales staff take site visits: they see the firm's calendar, book, move and cancel visits, mark
// them done and keep their own hours. The owner does all of that, sets anyone's hours and the
// firm's visit settings.

/** The firm's Visits calendar. */
export const canSeeVisits = (viewer: Viewer, target?: FirmScoped): boolean => roleInFirm(viewer, ['owner', 'sales'], target);
/** Book, move or cancel a visit, and mark it done or no one home. */
export const canManageVisit = (viewer: Viewer, visit: FirmScoped): boolean => roleInFirm(viewer, ['owner', 'sales'], visit);
/** The firm's visit length, buffer, notice, horizon and whether homeowners may book online. */
export const canEditVisitSettings = (viewer: Viewer, target?: FirmScoped): boolean => roleInFirm(viewer, ['owner'], target);

/** Someone's weekly hours and days off (a membership): their own, or anyone's for the owner. */
export function canEditAvailability(viewer: Viewer, membership: FirmScoped & { user?: { id: string } }): boolean {
  if (!roleInFirm(viewer, ['owner', 'sales'], membership)) return false;
  return viewer.role === 'owner' || membership.user?.id === viewer.userId;
}
