import { roleInFirm, type FirmScoped, type Viewer } from '../viewer';

// The Rate book holds the firm's costs and margins: the owner's alone.

export const canSeeRates = (viewer: Viewer, target?: FirmScoped): boolean => roleInFirm(viewer, ['owner'], target);
/** Change a draft version. */
export const canEditRates = (viewer: Viewer, target?: FirmScoped): boolean => roleInFirm(viewer, ['owner'], target);
/** Make a version the one that prices every new estimate. */
export const canPublishRates = (viewer: Viewer, target?: FirmScoped): boolean => roleInFirm(viewer, ['owner'], target);
