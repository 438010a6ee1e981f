/**
 * The firm's open visit slots, from each salesperson's availability and their live visits, by the
 * pure `openSlots`. The public slots endpoint, the staff booking form and the booking check all
 * ask here, so what is offered and what is accepted are the same thing.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { openSlots } from '~/lib/visits';
import { now as clockNow } from '../clock';
import { Company } from '../companies/company.entity';
import { Availability } from './availability.entity';
import { Visit } from './visit.entity';

export type FirmSlot = { start: Date; end: Date; salespersonId: string };

/** The firm's visit rules as `openSlots` takes them. */
export function slotRulesOf(company: Company) {
  return {
    timeZone: company.timeZone,
    visitMinutes: company.visitMinutes,
    bufferMinutes: company.visitBufferMinutes,
    stepMinutes: company.visitStepMinutes,
    minNoticeMinutes: company.visitMinNoticeMinutes,
    horizonDays: company.visitHorizonDays,
  };
}

export type SlotQuery = {
  /** One salesperson's slots (a membership id), or everyone's who has availability. */
  salespersonId?: string;
  now?: Date;
  /** Leave this visit out of the busy times (it is the one being moved). */
  ignoreVisitId?: string;
  /** Staff may book inside the minimum notice (a homeowner on the phone asks for tomorrow morning). */
  ignoreNotice?: boolean;
};

/**
 * Open slots of one salesperson or the whole team, sorted by start (then by person). With the
 * team, a time open for several people appears once per person.
 */
export async function openSlotsOfFirm(em: EntityManager, companyId: string, query: SlotQuery = {}): Promise<FirmSlot[]> {
  const at = query.now ?? clockNow();
  const company = await em.findOneOrFail(Company, { id: companyId });
  const rules = slotRulesOf(company);
  const availability = await em.find(
    Availability,
    { company: companyId, ...(query.salespersonId ? { membership: query.salespersonId } : {}) },
    { orderBy: { createdAt: 'asc', id: 'asc' } },
  );
  if (availability.length === 0) return [];
  const windowEnd = new Date(at.getTime() + (rules.horizonDays + 2) * 24 * 60 * 60 * 1000);
  const visits = await em.find(
    Visit,
    {
      company: companyId,
      salesperson: { $in: availability.map((a) => a.membership.id) },
      status: { $ne: 'cancelled' },
      blockedUntil: { $gt: new Date(at.getTime() - 24 * 60 * 60 * 1000) },
      startsAt: { $lt: windowEnd },
      ...(query.ignoreVisitId ? { id: { $ne: query.ignoreVisitId } } : {}),
    },
    { fields: ['startsAt', 'endsAt', 'blockedUntil', 'salesperson'] },
  );
  const slots: FirmSlot[] = [];
  for (const person of availability) {
    // `openSlots` widens each visit by the buffer on both sides, which is what the database's
    // rule (each visit's [start, end + buffer) apart) comes to while the buffer is unchanged.
    const busy = visits.filter((v) => v.salesperson?.id === person.membership.id).map((v) => ({ start: v.startsAt, end: v.endsAt }));
    for (const slot of openSlots({
      ...rules,
      minNoticeMinutes: query.ignoreNotice ? 0 : rules.minNoticeMinutes,
      weekly: person.weekly,
      daysOff: person.daysOff,
      busy,
      now: at,
    })) {
      slots.push({ ...slot, salespersonId: person.membership.id });
    }
  }
  return slots.sort((a, b) => a.start.getTime() - b.start.getTime() || a.salespersonId.localeCompare(b.salespersonId));
}

/** The first few slots at or after `from` (or the first few of all when none is), for a 409's alternatives. */
export function nextSlotsAfter(slots: FirmSlot[], from: Date, count = 5): FirmSlot[] {
  const later = slots.filter((s) => s.start.getTime() >= from.getTime());
  return (later.length ? later : slots).slice(0, count);
}
