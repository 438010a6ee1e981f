import { roleInFirm, type FirmScoped, type Viewer } from '../viewer';

/** Setup: the firm's profile, the widget's look and the sites allowed to embed it. The owner only. */
export const canUseSetup = (viewer: Viewer, target?: FirmScoped): boolean => roleInFirm(viewer, ['owner'], target);
