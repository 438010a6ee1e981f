/**
 * The rules for moving an inquiry from one stage to another, as one pure function: the server
 * enforces them (POST /api/app/leads/ID/stage) and the stage control asks the same questions
 * before it sends (a skip needs a confirmation, Not going ahead needs a reason).
 * Safe for islands and the server alike.
 */
import { LEAD_STAGES, stageLabel, type LeadStage } from './labels';

export const NOT_GOING_AHEAD: LeadStage = 'not-going-ahead';

/** The stages from New inquiry to Going ahead, in the order an inquiry normally takes them. */
const MAIN_LINE: LeadStage[] = LEAD_STAGES.map((s) => s.id).filter((id) => id !== NOT_GOING_AHEAD);

/**
 * The stages a forward move passes over without stopping (New inquiry → Measured skips Spoken to
 * and Visit booked). Empty for a move of one stage, a move back, and any move to or from Not going
 * ahead (reopening an inquiry may pick up wherever it now stands).
 */
export function skippedStages(from: LeadStage, to: LeadStage): LeadStage[] {
  if (from === NOT_GOING_AHEAD || to === NOT_GOING_AHEAD) return [];
  const a = MAIN_LINE.indexOf(from);
  const b = MAIN_LINE.indexOf(to);
  return b - a > 1 ? MAIN_LINE.slice(a + 1, b) : [];
}

export type StageMoveRequest = {
  from: LeadStage;
  to: LeadStage;
  reason?: string;
  confirm?: boolean;
  /** The firm's list of reasons an inquiry is not going ahead. */
  reasons: readonly string[];
};

/** 400: the request cannot be right as sent. 409: it can be, once the person confirms the skip. */
export type StageMoveVerdict = { ok: true } | { ok: false; status: 400 | 409; message: string; fields: Record<string, string> };

export function skipMessage(skipped: LeadStage[]): string {
  return `This skips ${skipped.map(stageLabel).join(', ')}. Confirm to move it anyway.`;
}

export function checkStageMove({ from, to, reason, confirm, reasons }: StageMoveRequest): StageMoveVerdict {
  if (to === from) return refuse(400, { to: `It is already at ${stageLabel(to)}.` });
  if (to === NOT_GOING_AHEAD) {
    if (!reason) return refuse(400, { reason: 'Choose why it is not going ahead.' });
    if (!reasons.includes(reason)) return refuse(400, { reason: 'Choose one of the reasons on your list.' });
  } else if (reason !== undefined) {
    return refuse(400, { reason: 'A reason is only given when it is not going ahead.' });
  }
  const skipped = skippedStages(from, to);
  if (skipped.length > 0 && confirm !== true) return { ok: false, status: 409, message: skipMessage(skipped), fields: { to: skipMessage(skipped) } };
  return { ok: true };
}

function refuse(status: 400, fields: Record<string, string>): StageMoveVerdict {
  return { ok: false, status, message: Object.values(fields)[0] ?? 'Some fields need attention.', fields };
}
