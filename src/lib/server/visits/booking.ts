/**
 * Booking, moving and cancelling site visits. The open-slot check comes first, so a time nobody
 * offered is refused with a plain message; the guarantee against double booking is the database's
 * exclusion constraint (`visit_no_overlap`), so when two requests race for one slot exactly one
 * commits and the other gets `SlotTaken` with the next open slots.
 *
 * Each change, its timeline entry, the inquiry's stage and the invitations commit together.
 * Timeline entries are kind `visit` with `data: { action, visitId, at, text }` (`action`: booked,
 * moved, cancelled, done, no-show; `at`: the visit's start).
 */
import { DriverException, LockMode } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import { formatInZone } from '~/lib/shared/time';
import { reminderDueAt } from '~/lib/visits';
import { isId } from '~/lib/shared/ids';
import type { VisitBookedVia, VisitCancelledBy, SlotView } from '~/lib/shared/visit-schemas';
import type { LeadStage } from '~/lib/shared/labels';
import { Conflict, InvalidInput, NotFound } from '../errors';
import { now as clockNow } from '../clock';
import { Company } from '../companies/company.entity';
import { Membership } from '../users/membership.entity';
import { User } from '../users/user.entity';
import { Lead } from '../leads/lead.entity';
import { recordLeadEvent } from '../leads/lead-events';
import { kickMailDelivery } from '../mail/delivery-job';
import { Visit } from './visit.entity';
import { nextSlotsAfter, openSlotsOfFirm, type FirmSlot } from './open-slots';
import { queueVisitMails } from './visit-mails';

/** The slot was taken (or is not open); `extra.alternatives` lists the next open ones. */
export class SlotTaken extends Conflict {
  constructor(message: string, alternatives: FirmSlot[]) {
    super(message, { start: message });
    this.extra = { alternatives: alternatives.map(slotView) };
  }
}

export function slotView(slot: FirmSlot): SlotView {
  return { start: slot.start.toISOString(), end: slot.end.toISOString(), salespersonId: slot.salespersonId };
}

/** Stages before a booked visit: booking moves the inquiry on to Visit booked from these. */
const BEFORE_VISIT: LeadStage[] = ['new', 'spoken-to'];

export type BookingRequest = {
  companyId: string;
  leadId: string;
  start: Date;
  /** Whose slot; absent from the widget when the firm offers the team's times: the inquiry's assignee if free, else the first free person. */
  salespersonId?: string;
  via: VisitBookedVia;
  /** The staff member booking (null for the homeowner). */
  bookedByUserId?: string | null;
  note?: string;
  now?: Date;
};

/**
 * Takes the firm's booking lock until the transaction ends, so one firm's bookings and moves check
 * the open slots one at a time and a loser of a race sees the winner's visit (a 409 with the next
 * open times). Without it, concurrent inserts that overlap wait on each other inside the exclusion
 * constraint's check and PostgreSQL breaks the circle after `deadlock_timeout` by failing one with
 * 40P01 (Source: PostgreSQL 15 documentation, §13.3.4 "Deadlocks", and §13.3.5 "Advisory Locks").
 * The constraint stays the guarantee; the lock only keeps the race orderly.
 */
async function lockFirmBookings(tx: EntityManager, companyId: string): Promise<void> {
  await tx.execute('select pg_advisory_xact_lock(hashtextextended(?, 0))', [`visit-booking:${companyId}`]);
}

/**
 * The database refused the visit as overlapping another (23P01, exclusion violation), or broke a
 * wait between two overlapping inserts by failing this one (40P01, deadlock; the firm's lock should
 * prevent that, but another writer of `visit` would not take it). Either way the time was lost.
 */
function isOverlapRefusal(error: unknown): boolean {
  const code = error instanceof DriverException ? (error as DriverException & { code?: string }).code : undefined;
  return code === '23P01' || code === '40P01';
}

/** The slot chosen among the open ones: an exact start, for the person asked for or the best one free. */
function pickSlot(slots: FirmSlot[], start: Date, preferred: string | null | undefined, required: string | undefined): FirmSlot | undefined {
  const atStart = slots.filter((s) => s.start.getTime() === start.getTime() && (!required || s.salespersonId === required));
  return atStart.find((s) => s.salespersonId === preferred) ?? atStart[0];
}

async function liveLead(em: EntityManager, companyId: string, leadId: string): Promise<Lead> {
  if (!isId(leadId)) throw new NotFound('No such inquiry.');
  const lead = await em.findOne(Lead, { id: leadId, company: companyId, deletedAt: null }, { lockMode: LockMode.PESSIMISTIC_WRITE });
  if (!lead) throw new NotFound('No such inquiry.');
  return lead;
}

async function visitText(em: EntityManager, company: Company, verb: string, visit: Visit): Promise<string> {
  const person = visit.salesperson ? await em.findOne(Membership, { id: visit.salesperson.id }, { populate: ['user'] }) : null;
  return `${verb} for ${formatInZone(visit.startsAt, company.timeZone, 'dateTimeZone')}${person ? ` with ${person.user.name}` : ''}`;
}

/** Books a visit for the inquiry. Throws `SlotTaken` (409) when the time is not open or was just taken. */
export async function bookVisit(em: EntityManager, request: BookingRequest): Promise<Visit> {
  const at = request.now ?? clockNow();
  const staffBooking = request.via === 'staff';
  try {
    const visit = await em.transactional(async (tx) => {
      await lockFirmBookings(tx, request.companyId);
      const company = await tx.findOneOrFail(Company, { id: request.companyId });
      const lead = await liveLead(tx, request.companyId, request.leadId);
      const existing = await tx.findOne(Visit, { company: request.companyId, lead, status: 'booked', endsAt: { $gt: at } });
      if (existing)
        throw new Conflict('This inquiry already has a visit booked. Move that visit instead.', { start: 'This inquiry already has a visit booked.' });
      if (request.salespersonId && !(await tx.findOne(Membership, { id: request.salespersonId, company: request.companyId }))) {
        throw new InvalidInput('Some fields need attention.', { salespersonId: 'Choose someone on your team.' });
      }
      const slots = await openSlotsOfFirm(tx, request.companyId, { salespersonId: request.salespersonId, now: at, ignoreNotice: staffBooking });
      const slot = pickSlot(slots, request.start, lead.assignee?.id, request.salespersonId);
      if (!slot) throw new SlotTaken('That time is no longer open. Choose another.', nextSlotsAfter(slots, request.start));
      const visit = tx.create(Visit, {
        company: request.companyId,
        lead,
        salesperson: tx.getReference(Membership, slot.salespersonId),
        startsAt: slot.start,
        endsAt: slot.end,
        blockedUntil: new Date(slot.end.getTime() + company.visitBufferMinutes * 60_000),
        bookedVia: request.via,
        bookedBy: request.bookedByUserId ? tx.getReference(User, request.bookedByUserId) : null,
        note: request.note?.trim() || null,
        // The day-before reminder (visit-reminders.ts): 09:00 on the firm's clock, or at once.
        reminderDueAt: reminderDueAt(slot.start, company.timeZone, at),
      });
      if (BEFORE_VISIT.includes(lead.stage)) {
        recordLeadEvent(tx, lead, 'stage-moved', { actorUserId: request.bookedByUserId ?? null, at, data: { from: lead.stage, to: 'visit-booked' } });
        lead.stage = 'visit-booked';
      }
      if (!lead.assignee) lead.assignee = tx.getReference(Membership, slot.salespersonId);
      await tx.flush();
      recordLeadEvent(tx, lead, 'visit', {
        actorUserId: request.bookedByUserId ?? null,
        at,
        data: { action: 'booked', visitId: visit.id, at: visit.startsAt.toISOString(), text: await visitText(tx, company, 'Visit booked', visit) },
      });
      await queueVisitMails(tx, visit, 'booked');
      return visit;
    });
    kickMailDelivery();
    return visit;
  } catch (error) {
    if (!isOverlapRefusal(error)) throw error;
    const slots = await openSlotsOfFirm(em.fork(), request.companyId, { salespersonId: request.salespersonId, now: at, ignoreNotice: staffBooking });
    throw new SlotTaken('Someone has just booked that time. Choose another.', nextSlotsAfter(slots, request.start));
  }
}

/** A visit of the firm (any status), or not found. */
export async function visitOfCompany(em: EntityManager, companyId: string, visitId: string, lock = false): Promise<Visit> {
  if (!isId(visitId)) throw new NotFound('No such visit.');
  const visit = await em.findOne(Visit, { id: visitId, company: companyId }, lock ? { lockMode: LockMode.PESSIMISTIC_WRITE } : {});
  if (!visit) throw new NotFound('No such visit.');
  return visit;
}

export type MoveRequest = {
  companyId: string;
  visitId: string;
  start: Date;
  salespersonId?: string;
  by: VisitCancelledBy;
  actorUserId?: string | null;
  now?: Date;
};

/** Moves a booked visit to another open time (and person); its invitation's SEQUENCE goes up. */
export async function moveVisit(em: EntityManager, request: MoveRequest): Promise<Visit> {
  const at = request.now ?? clockNow();
  const staffMove = request.by === 'staff';
  let personAsked = request.salespersonId;
  try {
    const visit = await em.transactional(async (tx) => {
      await lockFirmBookings(tx, request.companyId);
      const company = await tx.findOneOrFail(Company, { id: request.companyId });
      const visit = await visitOfCompany(tx, request.companyId, request.visitId, true);
      if (visit.status !== 'booked') throw new Conflict('Only a booked visit can be moved.', { start: 'This visit is no longer booked.' });
      personAsked ??= visit.salesperson?.id;
      const slots = await openSlotsOfFirm(tx, request.companyId, { salespersonId: personAsked, now: at, ignoreVisitId: visit.id, ignoreNotice: staffMove });
      const slot = pickSlot(slots, request.start, visit.salesperson?.id, personAsked);
      if (!slot) throw new SlotTaken('That time is not open. Choose another.', nextSlotsAfter(slots, request.start));
      visit.startsAt = slot.start;
      visit.endsAt = slot.end;
      visit.blockedUntil = new Date(slot.end.getTime() + company.visitBufferMinutes * 60_000);
      const previousSalespersonId = visit.salesperson?.id ?? null;
      visit.salesperson = tx.getReference(Membership, slot.salespersonId);
      visit.sequence += 1;
      // A reminder for the new time, even if the old one was sent.
      visit.reminderDueAt = reminderDueAt(slot.start, company.timeZone, at);
      visit.reminderSentAt = null;
      const lead = await tx.findOneOrFail(Lead, { id: visit.lead.id, company: request.companyId });
      await tx.flush();
      recordLeadEvent(tx, lead, 'visit', {
        actorUserId: request.actorUserId ?? null,
        at,
        data: {
          action: 'moved',
          visitId: visit.id,
          at: visit.startsAt.toISOString(),
          text: await visitText(tx, company, 'Visit moved', visit),
          by: request.by,
        },
      });
      await queueVisitMails(tx, visit, 'moved', { by: request.by, previousSalespersonId });
      return visit;
    });
    kickMailDelivery();
    return visit;
  } catch (error) {
    if (!isOverlapRefusal(error)) throw error;
    const slots = await openSlotsOfFirm(em.fork(), request.companyId, {
      salespersonId: personAsked,
      now: at,
      ignoreVisitId: request.visitId,
      ignoreNotice: staffMove,
    });
    throw new SlotTaken('Someone has just booked that time. Choose another.', nextSlotsAfter(slots, request.start));
  }
}

/** Cancels a booked visit: its time is free again, and everyone gets a cancellation (METHOD:CANCEL). */
export async function cancelVisit(
  em: EntityManager,
  request: { companyId: string; visitId: string; by: VisitCancelledBy; actorUserId?: string | null; now?: Date },
): Promise<Visit> {
  const at = request.now ?? clockNow();
  const visit = await em.transactional(async (tx) => {
    const company = await tx.findOneOrFail(Company, { id: request.companyId });
    const visit = await visitOfCompany(tx, request.companyId, request.visitId, true);
    if (visit.status !== 'booked') throw new Conflict('Only a booked visit can be cancelled.', { visit: 'This visit is no longer booked.' });
    visit.status = 'cancelled';
    visit.cancelledAt = at;
    visit.cancelledBy = request.by;
    visit.sequence += 1;
    const lead = await tx.findOneOrFail(Lead, { id: visit.lead.id, company: request.companyId });
    // Nothing is booked any more: an inquiry that was waiting for this visit goes back a stage.
    if (lead.stage === 'visit-booked') {
      recordLeadEvent(tx, lead, 'stage-moved', { actorUserId: request.actorUserId ?? null, at, data: { from: lead.stage, to: 'spoken-to' } });
      lead.stage = 'spoken-to';
    }
    recordLeadEvent(tx, lead, 'visit', {
      actorUserId: request.actorUserId ?? null,
      at,
      data: {
        action: 'cancelled',
        visitId: visit.id,
        at: visit.startsAt.toISOString(),
        text: await visitText(tx, company, request.by === 'homeowner' ? 'Visit cancelled by the homeowner, was' : 'Visit cancelled, was', visit),
        by: request.by,
      },
    });
    await queueVisitMails(tx, visit, 'cancelled');
    return visit;
  });
  kickMailDelivery();
  return visit;
}
