import { roleInFirm, type FirmScoped, type Viewer } from '../viewer';

// Sales staff triage inquiries, move them through stages and assign them; the owner may do all
// of that and erase one (a homeowner asking to be forgotten is the firm's decision).

/** The firm's list of inquiries. */
export const canSeeLeads = (viewer: Viewer, target?: FirmScoped): boolean => roleInFirm(viewer, ['owner', 'sales'], target);
export const canSeeLead = (viewer: Viewer, lead: FirmScoped): boolean => roleInFirm(viewer, ['owner', 'sales'], lead);
/** Stage, notes and the homeowner's contact details. */
export const canEditLead = (viewer: Viewer, lead: FirmScoped): boolean => roleInFirm(viewer, ['owner', 'sales'], lead);
/** Give it to someone on the team (or take it). */
export const canAssignLead = (viewer: Viewer, lead: FirmScoped): boolean => roleInFirm(viewer, ['owner', 'sales'], lead);
/** Type in an inquiry taken on the phone. */
export const canEnterLead = (viewer: Viewer, target?: FirmScoped): boolean => roleInFirm(viewer, ['owner', 'sales'], target);
/** Delete one (soft) and restore it within the restore window. */
export const canDeleteLead = (viewer: Viewer, lead: FirmScoped): boolean => roleInFirm(viewer, ['owner'], lead);
/** The firm's inquiries as a file (names, phones, e-mails of every homeowner): the owner's call. */
export const canExportLeads = (viewer: Viewer, target?: FirmScoped): boolean => roleInFirm(viewer, ['owner'], target);
