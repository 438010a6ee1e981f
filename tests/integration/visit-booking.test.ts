import { afterAll, afterEach, beforeAll, describe, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import { getOrm } from '../../src/lib/server/boot/orm';
import { Availability } from '../../src/lib/server/visits/availability.entity';
import { Visit } from '../../src/lib/server/visits/visit.entity';
import { Lead } from '../../src/lib/server/leads/lead.entity';
import * as bookRoute from '../../src/pages/api/app/leads/[id]/visits';
import * as moveRoute from '../../src/pages/api/app/visits/[id]/move';
import * as cancelRoute from '../../src/pages/api/app/visits/[id]/cancel';
import * as slotsRoute from '../../src/pages/api/app/visits/slots';
import { buildFirm } from '../helpers/accounts';
import { buildLead } from '../helpers/factories';
import { callAsStaff, type StaffCaller } from '../helpers/staff-route';
import { useFakeClock } from '../helpers/fake-clock';

// The booking rules (one live visit per inquiry, a travel buffer kept after each visit, a 409 with
// the next open times) are Lapwing's own; the guarantee under a race is PostgreSQL's exclusion
// constraint. Source: PostgreSQL 15 documentation, §8.17.10 "Constraints on Ranges" (EXCLUDE USING
// gist with btree_gist for the scalar column).

let orm: MikroORM;
beforeAll(async () => {
  orm = await getOrm();
});
afterAll(async () => {
  await orm.close();
});
const em = () => orm.em.fork();

let clock: ReturnType<typeof useFakeClock> | undefined;
afterEach(() => clock?.restore());

/** A firm in New York time with an owner and two salespeople who take visits Monday to Friday, 09:00–17:00. */
async function firmWithHours() {
  const fork = em();
  const firm = await buildFirm(
    fork,
    [
      { name: 'Opal', role: 'owner' },
      { name: 'Sid', role: 'sales' },
      { name: 'Ruth', role: 'sales' },
    ],
    { timeZone: 'America/New_York' },
  );
  Object.assign(firm.company, { visitMinutes: 60, visitBufferMinutes: 30, visitStepMinutes: 30, visitMinNoticeMinutes: 0, visitHorizonDays: 28 });
  const weekday = [{ from: '09:00', to: '17:00' }];
  for (const person of firm.members.slice(1)) {
    fork.create(Availability, {
      company: firm.company,
      membership: person.membership,
      weekly: { mon: weekday, tue: weekday, wed: weekday, thu: weekday, fri: weekday },
    });
  }
  await fork.flush();
  const as = (index: number): StaffCaller => ({ company: firm.company, user: firm.members[index]!.user, membership: firm.members[index]!.membership });
  return { ...firm, owner: as(0), sid: as(1), ruth: as(2) };
}

async function leadsOf(companyId: string, count: number): Promise<string[]> {
  const fork = em();
  const leads = Array.from({ length: count }, (_, i) => buildLead(fork, companyId, { name: `Racer ${i}` }));
  await fork.flush();
  return leads.map((l) => l.id);
}

const book = (as: StaffCaller, leadId: string, body: unknown) =>
  callAsStaff(bookRoute.POST, as, { em: em(), method: 'POST', path: `/api/app/leads/${leadId}/visits`, params: { id: leadId }, body });

describe('booking a site visit', () => {
  test('50 requests racing for one slot of one salesperson: exactly one is booked, 49 get a 409 with other open times', async () => {
    // Monday 4 January 2027, 07:00 in New York (EST, UTC−5). Source: IANA tz database, America/New_York.
    clock = useFakeClock('2027-01-04T12:00:00Z');
    const firm = await firmWithHours();
    const leads = await leadsOf(firm.company.id, 50);
    const start = '2027-01-05T14:00:00.000Z'; // Tuesday 09:00 EST
    const answers = await Promise.all(leads.map((id) => book(firm.owner, id, { start, salespersonId: firm.sid.membership.id })));
    const statuses = answers.map((a) => a.status).sort();
    expect(statuses.filter((s) => s === 201)).toHaveLength(1);
    expect(statuses.filter((s) => s === 409)).toHaveLength(49);
    for (const answer of answers.filter((a) => a.status === 409)) {
      const body = await answer.json();
      expect(body.error).toMatch(/book|open/i);
      expect(body.alternatives.length).toBeGreaterThan(0);
      // The next open time keeps the 30-minute buffer after the 09:00–10:00 visit: 10:30 EST.
      expect(body.alternatives[0]).toEqual({ start: '2027-01-05T15:30:00.000Z', end: '2027-01-05T16:30:00.000Z', salespersonId: firm.sid.membership.id });
    }
    const visits = await em().find(Visit, { company: firm.company.id });
    expect(visits.map((v) => v.startsAt.toISOString())).toEqual([start]);
  });

  test('50 requests for overlapping (not identical) times: one wins, and no two live visits come within the buffer', async () => {
    clock = useFakeClock('2027-01-04T12:00:00Z');
    const firm = await firmWithHours();
    const leads = await leadsOf(firm.company.id, 50);
    // Wednesday 09:00, 09:30, 10:00 and 10:30 EST: each overlaps the next once the 30-minute buffer is kept.
    const starts = ['2027-01-06T14:00:00.000Z', '2027-01-06T14:30:00.000Z', '2027-01-06T15:00:00.000Z'];
    const answers = await Promise.all(leads.map((id, i) => book(firm.owner, id, { start: starts[i % starts.length], salespersonId: firm.sid.membership.id })));
    expect(answers.filter((a) => a.status === 201)).toHaveLength(1);
    expect(answers.filter((a) => a.status === 409)).toHaveLength(49);
    const visits = await em().find(Visit, { company: firm.company.id, status: 'booked' });
    expect(visits).toHaveLength(1);
  });

  test('the same time for another salesperson is fine; the inquiry moves to Visit booked and gets the salesperson', async () => {
    clock = useFakeClock('2027-01-04T12:00:00Z');
    const firm = await firmWithHours();
    const [a, b] = await leadsOf(firm.company.id, 2);
    const start = '2027-01-07T19:00:00.000Z'; // Thursday 14:00 EST
    expect((await book(firm.sid, a!, { start, salespersonId: firm.sid.membership.id })).status).toBe(201);
    const second = await book(firm.sid, b!, { start, salespersonId: firm.ruth.membership.id });
    expect(second.status).toBe(201);
    expect((await second.json()).salespersonName).toBe('Ruth');
    const lead = await em().findOneOrFail(Lead, { id: b! });
    expect([lead.stage, lead.assignee?.id]).toEqual(['visit-booked', firm.ruth.membership.id]);
    // A second visit for the same inquiry is refused: move the first instead.
    const again = await book(firm.sid, b!, { start: '2027-01-08T19:00:00.000Z', salespersonId: firm.ruth.membership.id });
    expect(again.status).toBe(409);
  });

  test('a time outside the hours, or off the step, is refused with alternatives; bad input is a 400 naming the field', async () => {
    clock = useFakeClock('2027-01-04T12:00:00Z');
    const firm = await firmWithHours();
    const [lead] = await leadsOf(firm.company.id, 1);
    const early = await book(firm.sid, lead!, { start: '2027-01-05T12:00:00.000Z', salespersonId: firm.sid.membership.id }); // 07:00 EST
    expect(early.status).toBe(409);
    expect((await early.json()).alternatives[0].start).toBe('2027-01-05T14:00:00.000Z');
    const offStep = await book(firm.sid, lead!, { start: '2027-01-05T14:10:00.000Z', salespersonId: firm.sid.membership.id });
    expect(offStep.status).toBe(409);
    const bad = await book(firm.sid, lead!, { start: 'tomorrow', salespersonId: firm.sid.membership.id });
    expect(bad.status).toBe(400);
    expect((await bad.json()).fields).toHaveProperty('start');
  });

  test('moving keeps one visit with a higher sequence and frees the old time; cancelling frees the new one', async () => {
    clock = useFakeClock('2027-01-04T12:00:00Z');
    const firm = await firmWithHours();
    const [lead, other] = await leadsOf(firm.company.id, 2);
    const booked = await (await book(firm.sid, lead!, { start: '2027-01-05T14:00:00.000Z', salespersonId: firm.sid.membership.id })).json();
    const moved = await callAsStaff(moveRoute.POST, firm.sid, {
      em: em(),
      method: 'POST',
      path: `/api/app/visits/${booked.id}/move`,
      params: { id: booked.id },
      body: { start: '2027-01-05T16:00:00.000Z' },
    });
    expect(moved.status).toBe(200);
    expect(await moved.json()).toMatchObject({ id: booked.id, start: '2027-01-05T16:00:00.000Z', sequence: 1 });
    // The old 09:00 is open again for another inquiry.
    expect((await book(firm.sid, other!, { start: '2027-01-05T14:00:00.000Z', salespersonId: firm.sid.membership.id })).status).toBe(201);
    const cancelled = await callAsStaff(cancelRoute.POST, firm.sid, {
      em: em(),
      method: 'POST',
      path: `/api/app/visits/${booked.id}/cancel`,
      params: { id: booked.id },
    });
    expect(await cancelled.json()).toMatchObject({ status: 'cancelled', sequence: 2 });
    const slots = await (
      await callAsStaff(slotsRoute.GET, firm.sid, { em: em(), method: 'GET', path: `/api/app/visits/slots?salespersonId=${firm.sid.membership.id}` })
    ).json();
    expect(slots.slots.map((s: { start: string }) => s.start)).toContain('2027-01-05T16:00:00.000Z');
    expect((await em().findOneOrFail(Lead, { id: lead! })).stage).toBe('spoken-to');
  });

  test('another firm’s staff get 404 for this firm’s inquiries and visits, and change nothing', async () => {
    clock = useFakeClock('2027-01-04T12:00:00Z');
    const firm = await firmWithHours();
    const stranger = await firmWithHours();
    const [lead] = await leadsOf(firm.company.id, 1);
    const booked = await (await book(firm.sid, lead!, { start: '2027-01-05T14:00:00.000Z', salespersonId: firm.sid.membership.id })).json();
    expect((await book(stranger.owner, lead!, { start: '2027-01-05T16:00:00.000Z', salespersonId: stranger.sid.membership.id })).status).toBe(404);
    const move = await callAsStaff(moveRoute.POST, stranger.owner, {
      em: em(),
      method: 'POST',
      path: `/api/app/visits/${booked.id}/move`,
      params: { id: booked.id },
      body: { start: '2027-01-05T16:00:00.000Z' },
    });
    expect(move.status).toBe(404);
    const cancel = await callAsStaff(cancelRoute.POST, stranger.owner, {
      em: em(),
      method: 'POST',
      path: `/api/app/visits/${booked.id}/cancel`,
      params: { id: booked.id },
    });
    expect(cancel.status).toBe(404);
    // A salesperson of the other firm cannot be given a visit of this one either.
    const [mine] = await leadsOf(firm.company.id, 1);
    expect((await book(firm.sid, mine!, { start: '2027-01-05T16:00:00.000Z', salespersonId: stranger.sid.membership.id })).status).toBe(400);
    expect((await em().findOneOrFail(Visit, { id: booked.id })).status).toBe('booked');
  });
});

describe('the database’s own guarantee', () => {
  test('an overlapping visit written straight to the table, past every check of the app, is refused by the exclusion constraint', async () => {
    clock = useFakeClock('2027-01-04T12:00:00Z');
    const firm = await firmWithHours();
    const [a, b] = await leadsOf(firm.company.id, 2);
    expect((await book(firm.sid, a!, { start: '2027-01-05T14:00:00.000Z', salespersonId: firm.sid.membership.id })).status).toBe(201);
    const insert = (leadId: string, start: string, end: string, until: string, status = 'booked') =>
      em()
        .getConnection()
        .execute(
          `insert into "visit" ("id", "company_id", "lead_id", "salesperson_id", "starts_at", "ends_at", "blocked_until", "status", "booked_via")
           values (gen_random_uuid(), ?, ?, ?, ?, ?, ?, ?, 'staff')`,
          [firm.company.id, leadId, firm.sid.membership.id, start, end, until, status],
        );
    // 10:00–11:00 EST starts inside the first visit's 09:00–10:30 (its end plus the 30-minute buffer).
    // Source: PostgreSQL 15 documentation, §5.4.6 "Exclusion Constraints" (error 23P01).
    await expect(insert(b!, '2027-01-05T15:00:00Z', '2027-01-05T16:00:00Z', '2027-01-05T16:30:00Z')).rejects.toMatchObject({ code: '23P01' });
    // Half-open ranges: starting exactly when the first one's buffer ends is allowed, and a cancelled
    // visit blocks nothing.
    await expect(insert(b!, '2027-01-05T15:30:00Z', '2027-01-05T16:30:00Z', '2027-01-05T17:00:00Z')).resolves.toBeDefined();
    await expect(insert(b!, '2027-01-05T14:00:00Z', '2027-01-05T15:00:00Z', '2027-01-05T15:30:00Z', 'cancelled')).resolves.toBeDefined();
  });
});
