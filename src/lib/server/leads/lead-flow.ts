/**
 * The inquiry's workflow: moving it through the stages, giving it to a teammate, setting the next
 * follow-up, and undoing a stage move or an assignment from the timeline. Each change and its
 * timeline entry commit in one transaction, with the inquiry's row locked so two people acting at
 * once are applied one after the other.
 *
 * What the entries recorded here carry in `data`:
 * - `stage-moved`: `{ from, to, reason?, fromReason? }` — stages by id; `reason` when moved to Not
 *   going ahead; `fromReason` when moved away from it (the reason it had, so an undo restores it).
 * - `assigned`: `{ from, to, toName }` — membership ids (null for nobody) and the new assignee's name.
 * - `follow-up-set`: `{ at }` — the follow-up as an ISO 8601 string, null when cleared.
 *
 * Undo records no new entry: it restores the previous value and marks the undone entry
 * (`undoneAt`, `undoneBy`), which the timeline keeps and shows struck through with who undid it.
 * Only the latest entry of its kind that is not undone can be undone, so undoing step by step
 * walks the history back exactly.
 */
import { LockMode } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import { checkStageMove, NOT_GOING_AHEAD } from '~/lib/shared/stage-rules';
import { LEAD_STAGE_IDS, type LeadStage } from '~/lib/shared/labels';
import type { StageMove } from '~/lib/shared/lead-flow-schemas';
import { localInputToInstant } from '~/lib/shared/zone-input';
import { isId } from '~/lib/shared/ids';
import { Conflict, InvalidInput, NotFound } from '../errors';
import { now } from '../clock';
import type { Viewer } from '../viewer';
import { authorize } from '../auth/guard';
import { Membership } from '../users/membership.entity';
import { User } from '../users/user.entity';
import { Company } from '../companies/company.entity';
import { Lead } from './lead.entity';
import { LeadEvent } from './lead-event.entity';
import { recordLeadEvent } from './lead-events';
import { lostReasonsOf } from './lost-reasons';
import { FollowUpReminder } from './follow-up-reminder.entity';
import { canAssignLead, canEditLead, canSeeLead } from './policy';

/** A follow-up further out than this is almost certainly a typo in the year. */
const FOLLOW_UP_HORIZON_MS = 2 * 366 * 24 * 60 * 60 * 1000;

/**
 * One of the firm's inquiries for the workflow routes, without its estimate (they never need it).
 * Another firm's id, a malformed one or a deleted inquiry is not found.
 */
export async function workableLead(em: EntityManager, viewer: Viewer, leadId: string, lock = false): Promise<Lead> {
  if (!isId(leadId)) throw new NotFound('No such inquiry.');
  const lead = await em.findOne(
    Lead,
    { id: leadId, company: viewer.companyId, deletedAt: null },
    lock ? { lockMode: LockMode.PESSIMISTIC_WRITE, refresh: true } : { populate: ['assignee'] },
  );
  if (!lead) throw new NotFound('No such inquiry.');
  authorize(viewer, canSeeLead, lead);
  return lead;
}

export async function moveStage(em: EntityManager, viewer: Viewer, leadId: string, input: StageMove): Promise<Lead> {
  return em.transactional(async (tx) => {
    const lead = await workableLead(tx, viewer, leadId, true);
    authorize(viewer, canEditLead, lead);
    const verdict = checkStageMove({
      from: lead.stage,
      to: input.to,
      reason: input.reason,
      confirm: input.confirm,
      reasons: await lostReasonsOf(tx, viewer.companyId),
    });
    if (!verdict.ok) throw verdict.status === 409 ? new Conflict(verdict.message, verdict.fields) : new InvalidInput(verdict.message, verdict.fields);
    const data: Record<string, unknown> = { from: lead.stage, to: input.to };
    if (input.to === NOT_GOING_AHEAD) data.reason = input.reason;
    if (lead.stage === NOT_GOING_AHEAD && lead.lostReason) data.fromReason = lead.lostReason;
    lead.stage = input.to;
    lead.lostReason = input.to === NOT_GOING_AHEAD ? input.reason! : null;
    recordLeadEvent(tx, lead, 'stage-moved', { actorUserId: viewer.userId, at: now(), data });
    return lead;
  });
}

export async function assignLead(em: EntityManager, viewer: Viewer, leadId: string, membershipId: string | null): Promise<Lead> {
  return em.transactional(async (tx) => {
    const lead = await workableLead(tx, viewer, leadId, true);
    authorize(viewer, canAssignLead, lead);
    const to = membershipId ? await tx.findOne(Membership, { id: membershipId, company: viewer.companyId }, { populate: ['user'] }) : null;
    if (membershipId && !to) throw new InvalidInput('Some fields need attention.', { membershipId: 'Choose someone on your team.' });
    const from = lead.assignee?.id ?? null;
    if (from === (to?.id ?? null)) {
      throw new InvalidInput('Some fields need attention.', {
        membershipId: to ? `It is already assigned to ${to.user.name}.` : 'It is not assigned to anyone.',
      });
    }
    lead.assignee = to;
    recordLeadEvent(tx, lead, 'assigned', { actorUserId: viewer.userId, at: now(), data: { from, to: to?.id ?? null, toName: to?.user.name ?? null } });
    return lead;
  });
}

/**
 * Sets (or, with null, clears) the next follow-up. `at` is a `datetime-local` value read on the
 * firm's clock; it must be in the future. A reminder e-mail is owed when it comes due.
 */
export async function setFollowUp(em: EntityManager, viewer: Viewer, leadId: string, at: string | null): Promise<Lead> {
  return em.transactional(async (tx) => {
    const lead = await workableLead(tx, viewer, leadId, true);
    authorize(viewer, canEditLead, lead);
    const company = await tx.findOneOrFail(Company, { id: viewer.companyId });
    let due: Date | null = null;
    if (at !== null) {
      due = localInputToInstant(at, company.timeZone);
      if (!due) throw new InvalidInput('Some fields need attention.', { at: 'That date and time does not exist on your clock. Choose another.' });
      const ms = due.getTime() - now().getTime();
      if (ms <= 0) throw new InvalidInput('Some fields need attention.', { at: 'Choose a time in the future.' });
      if (ms > FOLLOW_UP_HORIZON_MS) throw new InvalidInput('Some fields need attention.', { at: 'Choose a date within the next two years.' });
    }
    lead.nextFollowUpAt = due;
    // The unsent reminder for the follow-up this one replaces is no longer owed.
    await tx.nativeDelete(FollowUpReminder, { company: viewer.companyId, lead: lead.id, sentAt: null });
    if (due) tx.create(FollowUpReminder, { company: viewer.companyId, lead, dueAt: due, setBy: viewer.userId });
    recordLeadEvent(tx, lead, 'follow-up-set', { actorUserId: viewer.userId, at: now(), data: { at: due?.toISOString() ?? null } });
    return lead;
  });
}

/** The kinds of timeline entries that can be undone. */
export const UNDOABLE_KINDS = ['stage-moved', 'assigned'] as const;

const isStage = (value: unknown): value is LeadStage => (LEAD_STAGE_IDS as readonly unknown[]).includes(value);

export async function undoLeadEvent(em: EntityManager, viewer: Viewer, leadId: string, eventId: string): Promise<Lead> {
  return em.transactional(async (tx) => {
    const lead = await workableLead(tx, viewer, leadId, true);
    if (!isId(eventId)) throw new NotFound('No such entry in this inquiry’s history.');
    const event = await tx.findOne(LeadEvent, { id: eventId, lead: lead.id, company: viewer.companyId });
    if (!event) throw new NotFound('No such entry in this inquiry’s history.');
    if (!(UNDOABLE_KINDS as readonly string[]).includes(event.kind)) throw new Conflict('Only stage moves and assignments can be undone.');
    authorize(viewer, event.kind === 'assigned' ? canAssignLead : canEditLead, lead);
    if (event.undoneAt) throw new Conflict('This was already undone.');
    const latest = await tx.findOne(
      LeadEvent,
      { lead: lead.id, company: viewer.companyId, kind: event.kind, undoneAt: null },
      { orderBy: { at: 'desc', createdAt: 'desc' } },
    );
    if (latest?.id !== event.id) {
      throw new Conflict(event.kind === 'assigned' ? 'Only the latest assignment can be undone.' : 'Only the latest stage move can be undone.');
    }
    const data = event.data;
    if (event.kind === 'stage-moved') {
      if (!isStage(data.from) || data.to !== lead.stage) throw new Conflict('The stage has changed since; move it by hand instead.');
      lead.stage = data.from;
      lead.lostReason = data.from === NOT_GOING_AHEAD && typeof data.fromReason === 'string' ? data.fromReason : null;
    } else {
      const current = lead.assignee?.id ?? null;
      if ((data.to ?? null) !== current) throw new Conflict('The assignee has changed since; assign it by hand instead.');
      const previous = typeof data.from === 'string' ? await tx.findOne(Membership, { id: data.from, company: viewer.companyId }) : null;
      if (typeof data.from === 'string' && !previous) throw new Conflict('The person it was assigned to is no longer on the team.');
      lead.assignee = previous;
    }
    event.undoneAt = now();
    event.undoneBy = tx.getReference(User, viewer.userId);
    return lead;
  });
}

/** The people an inquiry can be given to: everyone on the firm's team, by name. */
export async function assignableMembers(em: EntityManager, companyId: string): Promise<{ id: string; name: string }[]> {
  const members = await em.find(Membership, { company: companyId }, { populate: ['user'] });
  return members.map((m) => ({ id: m.id, name: m.user.name })).sort((a, b) => a.name.localeCompare(b.name));
}
