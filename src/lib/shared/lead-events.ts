/**
 * What can happen to an inquiry, as its timeline records it, with the words staff see.
 * Safe for islands and the server alike (no imports).
 */
export const LEAD_EVENT_KINDS = [
  'received',
  'viewed-by-homeowner',
  'opened',
  'stage-moved',
  'assigned',
  'follow-up-set',
  'note',
  'call',
  'email-sent',
  'visit',
  're-estimated',
  'merged',
  'deleted',
  'restored',
] as const;

export type LeadEventKind = (typeof LEAD_EVENT_KINDS)[number];

export const LEAD_EVENT_LABELS: Record<LeadEventKind, string> = {
  received: 'Received',
  'viewed-by-homeowner': 'Estimate viewed by the homeowner',
  opened: 'First opened',
  'stage-moved': 'Stage moved',
  assigned: 'Assigned',
  'follow-up-set': 'Follow-up set',
  note: 'Note',
  call: 'Call',
  'email-sent': 'E-mail sent',
  visit: 'Visit',
  're-estimated': 'Measured and re-priced',
  merged: 'Merged',
  deleted: 'Deleted',
  restored: 'Restored',
};
