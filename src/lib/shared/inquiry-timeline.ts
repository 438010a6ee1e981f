/**
 * What GET /api/app/leads/ID/timeline answers (and every workflow route after a change): the
 * timeline as staff read it, with the stage, assignee and follow-up as they now stand, so one
 * answer refreshes the page's controls and its history. Safe for islands.
 */
import type { LeadEventKind } from './lead-events';
import type { LeadStage } from './labels';

export type TimelineItem = {
  id: string;
  kind: LeadEventKind;
  label: string;
  /** ISO 8601 with the firm's offset, for `<time datetime>`. */
  at: string;
  /** The same moment as the firm's staff read it. */
  when: string;
  who: string;
  text: string;
  undoable: boolean;
  undone: { when: string; who: string } | null;
};

export type InquiryState = {
  stage: LeadStage;
  lostReason: string | null;
  assigneeId: string | null;
  nextFollowUpAt: string | null;
  nextFollowUpText: string | null;
  /** The follow-up as a `datetime-local` field shows it on the firm's clock. */
  nextFollowUpInput: string | null;
};

/** Events oldest first: the story reads from the top, the latest step at the bottom. */
export type TimelineView = { state: InquiryState; events: TimelineItem[] };

export const timelineUrl = (leadId: string) => `/api/app/leads/${leadId}/timeline`;
