/**
 * One line of text for each entry of an inquiry's timeline, from its kind and what it carries in
 * `data` (the shapes are listed beside the code that records each kind). Safe for islands.
 * Unknown or missing fields give a shorter line, never an error: old rows must always render.
 */
import type { LeadEventKind } from './lead-events';
import { LEAD_STAGE_IDS, stageLabel, type LeadStage } from './labels';

type Data = Record<string, unknown>;

const CALL_OUTCOMES: Record<string, string> = { reached: 'Reached them', voicemail: 'Left a voicemail', 'no-answer': 'No answer' };

const text = (value: unknown): string | null => (typeof value === 'string' && value.trim() ? value : null);
const stage = (value: unknown): LeadStage | null => ((LEAD_STAGE_IDS as readonly unknown[]).includes(value) ? (value as LeadStage) : null);

/** `date` writes a moment the firm's way (its zone); the page passes the firm's formatter. */
export function describeLeadEvent(kind: LeadEventKind | string, data: Data, date: (at: string) => string): string {
  switch (kind) {
    case 'received':
      return data.source === 'staff' ? 'Entered by staff' : 'Sent through the price widget';
    case 'viewed-by-homeowner':
      return 'The homeowner opened their estimate link';
    case 'opened':
      return 'Opened on the staff side for the first time';
    case 'stage-moved': {
      const from = stage(data.from);
      const to = stage(data.to);
      const move = from && to ? `${stageLabel(from)} → ${stageLabel(to)}` : to ? `To ${stageLabel(to)}` : 'Stage changed';
      return text(data.reason) ? `${move} (reason: ${text(data.reason)})` : move;
    }
    case 'assigned':
      return text(data.toName) ? `Assigned to ${text(data.toName)}` : 'Unassigned';
    case 'follow-up-set':
      return text(data.at) ? `Follow up on ${date(text(data.at)!)}` : 'Follow-up cleared';
    case 'note':
      return text(data.text) ?? 'Note';
    case 'call': {
      const outcome = CALL_OUTCOMES[String(data.outcome)] ?? 'Call logged';
      return text(data.note) ? `${outcome}: ${text(data.note)}` : outcome;
    }
    case 'email-sent':
      return [text(data.subject) ? `“${text(data.subject)}”` : 'E-mail', text(data.to) ? `to ${text(data.to)}` : null].filter(Boolean).join(' ');
    case 'visit':
      return text(data.text) ?? (text(data.at) ? `Visit on ${date(text(data.at)!)}` : 'Visit');
    case 're-estimated':
      return text(data.text) ?? 'Re-priced from the measured rooms';
    case 'merged':
      return text(data.otherReference) ? `${data.kept === false ? 'Merged into' : 'Merged with'} ${text(data.otherReference)}` : 'Merged';
    case 'deleted':
      return 'Deleted (restorable for 30 days)';
    case 'restored':
      return 'Restored';
    default:
      return '';
  }
}
