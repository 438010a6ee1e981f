/**
 * The price widget's visit step: the open times a homeowner may pick, and booking one for the
 * inquiry they have just sent. The public never sees who takes a visit: times are the team's
 * (each once, whoever is free then) or, for a proven inquiry with an assignee who has hours, that
 * person's; no staff name or id leaves the server.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { isId } from '~/lib/shared/ids';
import { dayInZone, zoneOrUtc } from '~/lib/shared/time';
import type { InquiryProof, PublicSlot, WidgetSlotsAnswer, WidgetVisitAnswer, WidgetVisitRequest } from '~/lib/shared/widget-visit-schemas';
import { zoneLabel } from '~/lib/shared/zone-label';
import { now as clockNow } from '../clock';
import type { Company } from '../companies/company.entity';
import { AppError, NotFound } from '../errors';
import { Lead } from '../leads/lead.entity';
import { viewKeyOpens } from '../leads/lead-view-keys';
import { Availability } from '../visits/availability.entity';
import { bookVisit, SlotTaken } from '../visits/booking';
import { openSlotsOfFirm, type FirmSlot } from '../visits/open-slots';
import { Visit } from '../visits/visit.entity';

/** The widget lists at most this many days with openings (the horizon caps it further). Our own choice. */
export const PUBLIC_SLOT_DAYS = 10;
/** And at most this many times in all, whatever the firm's step and hours. Our own choice. */
export const PUBLIC_SLOT_LIMIT = 300;

const NOT_OFFERED: WidgetSlotsAnswer = { offered: false, slots: [] };

/**
 * The inquiry the proof opens, of this firm only and not deleted: the private link's key is
 * checked as the estimate page checks it (the first key in constant time, or one minted since).
 * A wrong firm, id or key is the same 404.
 */
export async function provenInquiry(em: EntityManager, company: Company, proof: InquiryProof): Promise<Lead> {
  const unknown = () => new NotFound('We could not find that inquiry. Please call the firm to arrange the visit.');
  if (!isId(proof.lead) || !/^[A-Za-z0-9_-]{20,64}$/.test(proof.key)) throw unknown();
  const lead = await em.findOne(Lead, { id: proof.lead, company: company.id, deletedAt: null });
  if (!lead || !(await viewKeyOpens(em, lead, proof.key))) throw unknown();
  return lead;
}

/** Whether anyone at the firm has weekly hours at all (an availability row with at least one range). */
async function someoneHasHours(em: EntityManager, companyId: string): Promise<boolean> {
  const rows = await em.find(Availability, { company: companyId }, { fields: ['weekly'] });
  return rows.some((row) => Object.values(row.weekly).some((ranges) => (ranges?.length ?? 0) > 0));
}

/** Each start once (several people free at once is one time to the homeowner), on the first few days, capped. */
export function publicSlots(slots: FirmSlot[], timeZone: string): PublicSlot[] {
  const seen = new Set<number>();
  const days = new Set<string>();
  const answer: PublicSlot[] = [];
  for (const slot of slots) {
    const start = slot.start.getTime();
    if (seen.has(start)) continue;
    const day = dayInZone(slot.start, timeZone);
    if (!days.has(day) && days.size === PUBLIC_SLOT_DAYS) break;
    seen.add(start);
    days.add(day);
    answer.push({ start: slot.start.toISOString(), end: slot.end.toISOString() });
    if (answer.length === PUBLIC_SLOT_LIMIT) break;
  }
  return answer;
}

/**
 * Open times for the widget, with the minimum notice and the horizon. With a proof, an inquiry
 * that already has a visit gets none, and one whose assignee has open times gets theirs.
 */
export async function widgetSlots(em: EntityManager, company: Company, proof: InquiryProof | null): Promise<WidgetSlotsAnswer> {
  const lead = proof ? await provenInquiry(em, company, proof) : null;
  if (!company.onlineBooking || !(await someoneHasHours(em, company.id))) return NOT_OFFERED;
  const at = clockNow();
  if (lead && (await em.count(Visit, { company: company.id, lead, status: 'booked', endsAt: { $gt: at } })) > 0) return NOT_OFFERED;
  // The assignee's own times when they have any; else the team's, as booking then picks the first free person.
  const assigned = lead?.assignee ? await openSlotsOfFirm(em, company.id, { salespersonId: lead.assignee.id, now: at }) : [];
  const slots = assigned.length ? assigned : await openSlotsOfFirm(em, company.id, { now: at });
  const timeZone = zoneOrUtc(company.timeZone);
  return { offered: true, timeZone, zoneLabel: zoneLabel(timeZone, at), slots: publicSlots(slots, timeZone) };
}

/** A 409's next open times without whose they are, each start once. */
function withoutStaff(error: SlotTaken): AppError {
  const offered = (error.extra?.alternatives ?? []) as PublicSlot[];
  const byStart = new Map<string, PublicSlot>();
  for (const { start, end } of offered) if (!byStart.has(start)) byStart.set(start, { start, end });
  error.extra = { alternatives: [...byStart.values()] };
  return error;
}

/**
 * Books the chosen time for the proven inquiry (the assignee if free then, else the first person
 * free). 404 for an unknown inquiry or key, 403 when the firm does not take bookings online, 409
 * with `alternatives` when the time has gone.
 */
export async function bookFromWidget(em: EntityManager, company: Company, request: WidgetVisitRequest): Promise<WidgetVisitAnswer> {
  const lead = await provenInquiry(em, company, request);
  if (!company.onlineBooking) {
    throw new AppError(`${company.name} arranges visits by phone. They will call you to find a time.`, 403);
  }
  try {
    const visit = await bookVisit(em, {
      companyId: company.id,
      leadId: lead.id,
      start: new Date(request.start),
      via: 'widget',
      bookedByUserId: null,
      note: request.note,
    });
    return { visit: { start: visit.startsAt.toISOString(), end: visit.endsAt.toISOString(), timeZone: zoneOrUtc(company.timeZone) } };
  } catch (error) {
    if (error instanceof SlotTaken) throw withoutStaff(error);
    throw error;
  }
}
