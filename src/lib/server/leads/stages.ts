/** The stages a lead moves through on the Desk, in order. */
export const LEAD_STAGES = [
  { id: 'new', label: 'New inquiry' },
  { id: 'called-back', label: 'Called back' },
  { id: 'visit-booked', label: 'Visit booked' },
  { id: 'measured', label: 'Measured' },
  { id: 'quote-sent', label: 'Quote sent' },
  { id: 'won', label: 'Job won' },
  { id: 'not-proceeding', label: 'Not proceeding' },
] as const;

export type LeadStage = (typeof LEAD_STAGES)[number]['id'];

export function stageLabel(stage: LeadStage): string {
  return LEAD_STAGES.find((s) => s.id === stage)?.label ?? stage;
}
