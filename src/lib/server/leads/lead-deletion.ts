/**
 * Deleting an inquiry is soft: it leaves every list at once, an owner may restore it for 30 days,
 * and then the purge job removes it with its photos (`intake/purge-deleted-leads.ts`).
 *
 * Timeline data: `deleted` and `restored` carry `{}`; the actor is the owner who did it.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { Conflict, NotFound } from '../errors';
import { recordLeadEvent } from './lead-events';
import { Lead } from './lead.entity';
import { leadOfCompany } from './lead.repository';

/** How long a deleted inquiry can be restored before it is purged. */
export const RESTORE_DAYS = 30;
export const RESTORE_WINDOW_MS = RESTORE_DAYS * 24 * 60 * 60 * 1000;

export const purgeDueAt = (deletedAt: Date): Date => new Date(deletedAt.getTime() + RESTORE_WINDOW_MS);

/** Soft-deletes one of the firm's inquiries (the caller has checked `canDeleteLead`). */
export async function softDeleteLead(em: EntityManager, lead: Lead, actorUserId: string, now = new Date()): Promise<void> {
  lead.deletedAt = now;
  recordLeadEvent(em, lead, 'deleted', { actorUserId, at: now });
  await em.flush();
}

/** A deleted inquiry of the firm, for restoring (one merged into another is not one of them). */
export async function deletedLeadOfCompany(em: EntityManager, companyId: string, leadId: string): Promise<Lead> {
  const lead = await leadOfCompany(em, companyId, leadId, { includeDeleted: true });
  if (lead.mergedInto) throw new NotFound('No such lead.');
  return lead;
}

/** Brings a deleted inquiry back, within the restore window. */
export async function restoreLead(em: EntityManager, lead: Lead, actorUserId: string, now = new Date()): Promise<void> {
  if (!lead.deletedAt) throw new Conflict('This inquiry is not deleted.');
  if (now.getTime() >= purgeDueAt(lead.deletedAt).getTime()) {
    throw new Conflict(`This inquiry was deleted more than ${RESTORE_DAYS} days ago and can no longer be restored.`);
  }
  // Only the request that finds it still deleted restores it (and writes the timeline entry).
  const claimed = await em.nativeUpdate(Lead, { id: lead.id, company: lead.company, deletedAt: lead.deletedAt }, { deletedAt: null });
  if (claimed === 0) throw new Conflict('This inquiry is not deleted.');
  lead.deletedAt = null;
  recordLeadEvent(em, lead, 'restored', { actorUserId, at: now });
  await em.flush();
}

/** The firm's deleted inquiries that can still be restored, most recently deleted first. */
export function deletedLeads(em: EntityManager, companyId: string, now = new Date()): Promise<Lead[]> {
  return em.find(
    Lead,
    { company: companyId, deletedAt: { $ne: null, $gt: new Date(now.getTime() - RESTORE_WINDOW_MS) }, mergedInto: null },
    { orderBy: { deletedAt: 'desc' }, limit: 500 },
  );
}
