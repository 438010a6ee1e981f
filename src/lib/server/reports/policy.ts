import { roleInFirm, type FirmScoped, type Viewer } from '../viewer';

/** The firm's figures (funnel, response times, value going ahead, sources): the owner's alone. */
export const canSeeReports = (viewer: Viewer, target?: FirmScoped): boolean => roleInFirm(viewer, ['owner'], target);
