/**
 * Merging two inquiries of one homeowner: the kept inquiry takes over the other's history (its
 * timeline entries, notes and calls among them, and its photos), so its timeline shows both; the
 * other is marked merged (and deleted, so it leaves every list) and stays as a pointer: its old
 * address leads to the kept one, and its reference is named on the kept one's timeline.
 *
 * Timeline data: `merged` carries `{ other: leadId, otherReference: string, kept: boolean }` on each
 * side (`kept: true` on the inquiry that stays).
 *
 * A new table of per-inquiry rows belongs in `moveHistory` below, so a merge keeps it too.
 */
import { LockMode } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import { Conflict, InvalidInput, NotFound } from '../errors';
import { LeadEvent } from '../leads/lead-event.entity';
import { recordLeadEvent } from '../leads/lead-events';
import { Lead } from '../leads/lead.entity';
import { refreshTriageScore } from '../leads/triage';
import { LeadPhoto } from '../photos/lead-photo.entity';

const earliest = (a: Date | null, b: Date | null) => (a && b ? (a < b ? a : b) : (a ?? b));
const latest = (a: Date | null, b: Date | null) => (a && b ? (a > b ? a : b) : (a ?? b));

async function moveHistory(tx: EntityManager, companyId: string, from: Lead, to: Lead): Promise<void> {
  await tx.nativeUpdate(LeadEvent, { company: companyId, lead: from.id }, { lead: to.id });
  await tx.nativeUpdate(LeadPhoto, { company: companyId, lead: from.id }, { lead: to.id });
  // Inquiries flagged as looking like the merged one now look like the kept one.
  await tx.nativeUpdate(Lead, { company: companyId, duplicateOf: from.id, id: { $ne: to.id } }, { duplicateOf: to.id });
}

/**
 * Merges `leadId` into `intoId` (both the firm's own, open, not deleted) and returns the kept one.
 * The caller has checked that the viewer may edit both.
 */
export async function mergeLeads(
  em: EntityManager,
  input: { companyId: string; leadId: string; intoId: string; actorUserId: string; authorize?: (lead: Lead) => void },
  now = new Date(),
): Promise<Lead> {
  if (input.leadId === input.intoId) throw new InvalidInput('An inquiry cannot be merged into itself.', { into: 'Choose another inquiry.' });
  return em.transactional(async (tx) => {
    // Both rows locked, in one order, so two merges of the same pair cannot cross.
    const rows = await tx.find(
      Lead,
      { id: { $in: [input.leadId, input.intoId] }, company: input.companyId },
      { lockMode: LockMode.PESSIMISTIC_WRITE, orderBy: { id: 'asc' } },
    );
    const away = rows.find((l) => l.id === input.leadId);
    const kept = rows.find((l) => l.id === input.intoId);
    if (!away || away.deletedAt) throw new NotFound('No such lead.');
    if (!kept || kept.deletedAt) throw new NotFound('No such lead.');
    input.authorize?.(away);
    input.authorize?.(kept);
    if (away.mergedInto || kept.mergedInto) throw new Conflict('One of these inquiries was already merged.');

    await moveHistory(tx, input.companyId, away, kept);
    kept.openedAt = earliest(kept.openedAt, away.openedAt);
    kept.firstContactAt = earliest(kept.firstContactAt, away.firstContactAt);
    kept.lastContactAt = latest(kept.lastContactAt, away.lastContactAt);
    kept.nextFollowUpAt = kept.nextFollowUpAt ?? away.nextFollowUpAt;
    kept.assignee = kept.assignee ?? away.assignee;
    if (kept.duplicateOf?.id === away.id) kept.duplicateOf = null;
    away.mergedInto = kept;
    away.deletedAt = now;
    away.duplicateOf = null;

    recordLeadEvent(tx, kept, 'merged', { actorUserId: input.actorUserId, at: now, data: { other: away.id, otherReference: away.reference, kept: true } });
    recordLeadEvent(tx, away, 'merged', { actorUserId: input.actorUserId, at: now, data: { other: kept.id, otherReference: kept.reference, kept: false } });
    await refreshTriageScore(tx, kept, now);
    await tx.flush();
    return kept;
  });
}

/** Where an inquiry merged into another now lives, or null (for its old address). */
export async function mergedInto(em: EntityManager, companyId: string, leadId: string): Promise<Lead | null> {
  const lead = await em.findOne(Lead, { id: leadId, company: companyId, mergedInto: { $ne: null } }, { populate: ['mergedInto'] });
  let target = lead?.mergedInto ?? null;
  // A kept inquiry may itself have been merged later; follow the chain to the one that stays.
  for (let hops = 0; target?.mergedInto && hops < 10; hops++) target = await em.findOneOrFail(Lead, { id: target.mergedInto.id, company: companyId });
  return target;
}
