// The demo scenario's site visits: weekly hours for the firms' people who take visits, a day off
// next week, a booked visit for every demo inquiry at Visit booked (in the coming days, on open
// times, so the no-overlap rule holds), and one visit done last week on an inquiry at Measured,
// re-priced from its measured rooms. All times are relative to when the demo is seeded.
import type { EntityManager } from '@mikro-orm/postgresql';
import { TZDate } from '@date-fns/tz';
import { addDays, addWeeks, format, startOfWeek } from 'date-fns';
import { estimate, type RateBook } from '~/lib/estimate';
import { reminderDueAt } from '~/lib/visits';
import { formatInZone } from '~/lib/shared/time';
import type { WeeklyHours } from '~/lib/shared/visit-schemas';
import type { Company } from '../companies/company.entity';
import { Membership } from '../users/membership.entity';
import { Lead } from '../leads/lead.entity';
import { recordLeadEvent } from '../leads/lead-events';
import { leadInputs } from '../leads/lead-inputs';
import type { RateBookVersion } from '../rates/rate-book-version.entity';
import { Availability } from '../visits/availability.entity';
import { Visit } from '../visits/visit.entity';
import { openSlotsOfFirm, type FirmSlot } from '../visits/open-slots';
import { applyMeasuredEstimate, measuredProject } from '../visits/measured-rooms';

const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;

const morningAndAfternoon = [
  { from: '08:30', to: '12:00' },
  { from: '13:00', to: '17:00' },
];
const afternoon = [{ from: '13:00', to: '17:00' }];

/** Who takes visits when, by firm and e-mail; `dayOffNextWeek` is a weekday of the coming week (0 = Monday). */
const DEMO_HOURS: Record<string, Record<string, { weekly: WeeklyHours; dayOffNextWeek?: number }>> = {
  'cedar-hollow': {
    'sam@cedar-hollow.test': {
      weekly: { mon: morningAndAfternoon, tue: morningAndAfternoon, wed: morningAndAfternoon, thu: morningAndAfternoon, fri: morningAndAfternoon },
      dayOffNextWeek: 2,
    },
    'olive@cedar-hollow.test': { weekly: { tue: afternoon, thu: afternoon } },
  },
  northgate: {
    'nora@northgate.test': { weekly: { mon: [{ from: '09:00', to: '15:00' }], wed: [{ from: '09:00', to: '15:00' }], fri: [{ from: '09:00', to: '12:00' }] } },
  },
};

/** The local date of a weekday next week on the firm's clock, as 'YYYY-MM-DD'. */
function dateNextWeek(now: Date, timeZone: string, weekday: number): string {
  const monday = startOfWeek(addWeeks(new TZDate(now, timeZone), 1), { weekStartsOn: 1 });
  return format(addDays(monday, weekday), 'yyyy-MM-dd');
}

async function seedHours(em: EntityManager, company: Company, now: Date): Promise<number> {
  const hours = DEMO_HOURS[company.slug] ?? {};
  const team = await em.find(Membership, { company }, { populate: ['user'] });
  let added = 0;
  for (const membership of team) {
    const plan = hours[membership.user.email];
    if (!plan || (await em.findOne(Availability, { membership }))) continue;
    const daysOff = plan.dayOffNextWeek === undefined ? [] : [dateNextWeek(now, company.timeZone, plan.dayOffNextWeek)];
    em.create(Availability, { company, membership, weekly: plan.weekly, daysOff });
    added++;
  }
  await em.flush();
  return added;
}

function visitOn(em: EntityManager, company: Company, lead: Lead, slot: FirmSlot, bookedAt: Date, bookedBy: Membership): Visit {
  return em.create(Visit, {
    company,
    lead,
    salesperson: em.getReference(Membership, slot.salespersonId),
    startsAt: slot.start,
    endsAt: slot.end,
    blockedUntil: new Date(slot.end.getTime() + company.visitBufferMinutes * 60_000),
    bookedVia: 'staff',
    bookedBy: bookedBy.user,
    reminderDueAt: reminderDueAt(slot.start, company.timeZone, bookedAt),
  });
}

async function personName(em: EntityManager, membershipId: string): Promise<string> {
  return (await em.findOneOrFail(Membership, { id: membershipId }, { populate: ['user'] })).user.name;
}

/** Adds the demo's hours and visits where the firm has none yet; running it twice changes nothing. */
export async function seedDemoVisits(em: EntityManager, company: Company, version: RateBookVersion, rateBook: RateBook, now = new Date()): Promise<number> {
  let added = await seedHours(em, company, now);
  if ((await em.count(Visit, { company })) > 0) return added;
  const team = await em.find(Membership, { company }, { populate: ['user'], orderBy: { role: 'desc', createdAt: 'asc' } });
  const booker = team[0];
  if (!booker) return added;
  const when = (at: Date) => formatInZone(at, company.timeZone, 'dateTimeZone');

  // Upcoming: one visit per inquiry at Visit booked, about a day apart, each on a time still open.
  const waiting = await em.find(Lead, { company, stage: 'visit-booked', deletedAt: null }, { orderBy: { createdAt: 'asc' } });
  for (const [i, lead] of waiting.entries()) {
    const slots = await openSlotsOfFirm(em, company.id, { now });
    const slot = slots.find((s) => s.start.getTime() >= now.getTime() + (i + 1) * 20 * HOUR_MS) ?? slots.at(-1);
    if (!slot) break;
    const bookedAt = new Date(Math.min(lead.createdAt.getTime() + 4 * HOUR_MS, now.getTime() - 60_000));
    const visit = visitOn(em, company, lead, slot, bookedAt, booker);
    lead.assignee ??= em.getReference(Membership, slot.salespersonId);
    await em.flush();
    const text = `Visit booked for ${when(visit.startsAt)} with ${await personName(em, slot.salespersonId)}`;
    recordLeadEvent(em, lead, 'visit', {
      actorUserId: booker.user.id,
      at: bookedAt,
      data: { action: 'booked', visitId: visit.id, at: visit.startsAt.toISOString(), text },
    });
    added++;
  }

  // Last week: the first inquiry at Measured had its visit, and its rooms were measured and re-priced.
  const measured = await em.findOne(
    Lead,
    { company, stage: 'measured', deletedAt: null },
    { orderBy: { createdAt: 'asc' }, populate: ['estimate', 'rateBookVersion'] },
  );
  const lastWeek = new Date(now.getTime() - 8 * DAY_MS);
  const past = (await openSlotsOfFirm(em, company.id, { now: lastWeek, ignoreNotice: true })).find((s) => s.end.getTime() < now.getTime() - 2 * DAY_MS);
  if (measured && past) {
    const bookedAt = new Date(Math.min(measured.createdAt.getTime() + 4 * HOUR_MS, past.start.getTime() - DAY_MS));
    const visit = visitOn(em, company, measured, past, bookedAt, booker);
    const outcomeAt = new Date(past.end.getTime() + 10 * 60_000);
    visit.status = 'done';
    visit.outcomeAt = outcomeAt;
    measured.assignee ??= em.getReference(Membership, past.salespersonId);
    await em.flush();
    const withName = `${when(visit.startsAt)} with ${await personName(em, past.salespersonId)}`;
    const actorUserId = booker.user.id;
    const base = { visitId: visit.id, at: visit.startsAt.toISOString() };
    recordLeadEvent(em, measured, 'visit', { actorUserId, at: bookedAt, data: { action: 'booked', ...base, text: `Visit booked for ${withName}` } });
    recordLeadEvent(em, measured, 'visit', { actorUserId, at: outcomeAt, data: { action: 'done', ...base, text: `Visit done: ${withName}` } });
    // On site every room came out two inches longer than the homeowner's figures.
    const stored = leadInputs.read(measured.inputs);
    const rooms = { ...stored, rooms: stored.rooms.map((room) => (room.length === undefined ? room : { ...room, length: room.length + 2 })) };
    const project = measuredProject(rooms, stored);
    applyMeasuredEstimate(
      em,
      measured,
      project,
      { result: estimate(project, rateBook), version },
      { actorUserId, at: new Date(outcomeAt.getTime() + HOUR_MS) },
    );
    await em.flush();
    added++;
  }
  return added;
}
