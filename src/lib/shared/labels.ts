/**
 * The lists the product speaks in — stages, roles, contact methods, where an inquiry came from —
 * with the words people see, written once. Safe for islands and the server alike (no imports).
 */

/** The stages an inquiry moves through, in order; the last two end it. */
export const LEAD_STAGES = [
  { id: 'new', label: 'New inquiry' },
  { id: 'spoken-to', label: 'Spoken to' },
  { id: 'visit-booked', label: 'Visit booked' },
  { id: 'measured', label: 'Measured' },
  { id: 'quote-sent', label: 'Quote sent' },
  { id: 'going-ahead', label: 'Going ahead' },
  { id: 'not-going-ahead', label: 'Not going ahead' },
] as const;

export type LeadStage = (typeof LEAD_STAGES)[number]['id'];
export const LEAD_STAGE_IDS = LEAD_STAGES.map((s) => s.id) as [LeadStage, ...LeadStage[]];

export function stageLabel(stage: LeadStage): string {
  return LEAD_STAGES.find((s) => s.id === stage)?.label ?? stage;
}

/** Roles in a firm. */
export const STAFF_ROLES = ['owner', 'sales'] as const;
export type StaffRole = (typeof STAFF_ROLES)[number];

/** The role's name, short (menus, tables). */
export const ROLE_NAMES: Record<StaffRole, string> = { owner: 'Owner', sales: 'Sales' };

/** The role's name with what it may do (invitations, the team screen). */
export const ROLE_LABELS: Record<StaffRole, string> = {
  owner: 'Owner — everything, including Rate book, Setup and the team',
  sales: 'Sales — Inquiries and Visits',
};

/** How a homeowner would like to be contacted. */
export const CONTACT_METHODS = ['phone', 'email', 'text'] as const;
export type ContactMethod = (typeof CONTACT_METHODS)[number];

export const CONTACT_METHOD_LABELS: Record<ContactMethod, string> = { phone: 'Phone call', email: 'E-mail', text: 'Text message' };

/** Where an inquiry came from: the price widget on the firm's site, or typed in by staff. */
export const LEAD_SOURCES = ['widget', 'staff'] as const;
export type LeadSource = (typeof LEAD_SOURCES)[number];

export const LEAD_SOURCE_LABELS: Record<LeadSource, string> = { widget: 'Price widget', staff: 'Entered by staff' };

export function sourceLabel(source: LeadSource): string {
  return LEAD_SOURCE_LABELS[source];
}
