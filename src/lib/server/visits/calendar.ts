/**
 * The Visits calendar: the firm's live and finished visits that overlap a range, with the inquiry's
 * name, reference and address and whose visit it is. Cancelled visits are left out: their time is
 * free again, and the inquiry's history keeps the record.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import type { CalendarPerson, CalendarQuery, CalendarVisit } from '~/lib/shared/visit-calendar';
import { Membership } from '../users/membership.entity';
import { Availability } from './availability.entity';
import { Visit } from './visit.entity';

export async function calendarVisits(em: EntityManager, companyId: string, query: CalendarQuery): Promise<CalendarVisit[]> {
  const visits = await em.find(
    Visit,
    {
      company: companyId,
      status: { $ne: 'cancelled' },
      startsAt: { $lt: new Date(query.to) },
      endsAt: { $gt: new Date(query.from) },
      lead: { deletedAt: null },
      ...(query.salespersonId ? { salesperson: query.salespersonId } : {}),
    },
    { populate: ['lead', 'salesperson.user'], orderBy: { startsAt: 'asc', id: 'asc' } },
  );
  return visits.map((visit) => ({
    id: visit.id,
    leadId: visit.lead.id,
    leadName: visit.lead.name,
    reference: visit.lead.reference,
    address: visit.lead.address,
    postcode: visit.lead.postcode,
    salespersonId: visit.salesperson?.id ?? null,
    salespersonName: visit.salesperson?.user.name ?? null,
    start: visit.startsAt.toISOString(),
    end: visit.endsAt.toISOString(),
    status: visit.status,
    note: visit.note,
  }));
}

/** Everyone in the firm who may take visits (owners and sales), by name. */
export async function visitPeople(em: EntityManager, companyId: string): Promise<CalendarPerson[]> {
  const members = await em.find(Membership, { company: companyId, role: { $in: ['owner', 'sales'] } }, { populate: ['user'] });
  return members.map((m) => ({ id: m.id, name: m.user.name })).sort((a, b) => a.name.localeCompare(b.name) || a.id.localeCompare(b.id));
}

/** The weekly hours and days off of everyone who has set them, for shading the calendar's open hours. */
export async function firmHours(em: EntityManager, companyId: string) {
  const rows = await em.find(Availability, { company: companyId });
  return rows.map((row) => ({ membershipId: row.membership.id, weekly: row.weekly, daysOff: row.daysOff }));
}

/** The inquiry's booked visit still to come (at most one: booking refuses a second), for its page. */
export async function upcomingVisitOfLead(em: EntityManager, companyId: string, leadId: string, at: Date) {
  const visit = await em.findOne(
    Visit,
    { company: companyId, lead: leadId, status: 'booked', endsAt: { $gt: at } },
    { populate: ['salesperson.user'], orderBy: { startsAt: 'asc' } },
  );
  if (!visit) return null;
  return {
    id: visit.id,
    start: visit.startsAt.toISOString(),
    end: visit.endsAt.toISOString(),
    salespersonId: visit.salesperson?.id ?? null,
    salespersonName: visit.salesperson?.user.name ?? null,
    note: visit.note,
  };
}
