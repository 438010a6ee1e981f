import { afterAll, afterEach, beforeAll, describe, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import { getOrm } from '../../src/lib/server/boot/orm';
import { Company } from '../../src/lib/server/companies/company.entity';
import * as availabilityRoute from '../../src/pages/api/app/visits/availability/[membershipId]';
import * as calendarRoute from '../../src/pages/api/app/visits/index';
import * as settingsRoute from '../../src/pages/api/app/settings/visits';
import * as slotsRoute from '../../src/pages/api/app/visits/slots';
import * as bookRoute from '../../src/pages/api/app/leads/[id]/visits';
import * as cancelRoute from '../../src/pages/api/app/visits/[id]/cancel';
import { buildFirm } from '../helpers/accounts';
import { buildLead } from '../helpers/factories';
import { callAsStaff, type StaffCaller } from '../helpers/as-staff';
import { useFakeClock } from '../helpers/fake-clock';

// The staff side of Visits: each person's hours, the firm's settings and the calendar's range.
// The rules (who edits whose hours, a 42-day range, cancelled visits left off the calendar) are
// Lapwing's own; times are checked against the IANA tz database's offsets for America/New_York
// (EST = UTC−5 in January). Source: IANA tz database, northamerica file, Rule US.

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

async function firm() {
  const fork = em();
  const built = await buildFirm(
    fork,
    [
      { name: 'Opal', role: 'owner' },
      { name: 'Sid', role: 'sales' },
      { name: 'Ruth', role: 'sales' },
    ],
    { timeZone: 'America/New_York' },
  );
  Object.assign(built.company, { visitMinutes: 60, visitBufferMinutes: 30, visitStepMinutes: 30, visitMinNoticeMinutes: 0, visitHorizonDays: 28 });
  await fork.flush();
  const as = (index: number): StaffCaller => ({ company: built.company, user: built.members[index]!.user, membership: built.members[index]!.membership });
  return { ...built, owner: as(0), sid: as(1), ruth: as(2) };
}

const hoursOf = (as: StaffCaller | null, membershipId: string, method: 'GET' | 'PUT' = 'GET', body?: unknown) =>
  callAsStaff(method === 'GET' ? availabilityRoute.GET : availabilityRoute.PUT, as, {
    em: em(),
    method,
    path: `/api/app/visits/availability/${membershipId}`,
    params: { membershipId },
    body,
  });

const weekdays = (ranges: { from: string; to: string }[]) => ({ mon: ranges, tue: ranges, wed: ranges, thu: ranges, fri: ranges });

describe('weekly hours and days off', () => {
  test('a salesperson sets their own hours; they come back as saved, and the open times follow them', async () => {
    clock = useFakeClock('2027-01-04T12:00:00Z'); // Monday 07:00 EST
    const f = await firm();
    const empty = await hoursOf(f.sid, f.sid.membership.id);
    expect(empty.status).toBe(200);
    expect(await empty.json()).toEqual({ membershipId: f.sid.membership.id, name: 'Sid', weekly: {}, daysOff: [] });

    const body = {
      weekly: {
        mon: [
          { from: '13:00', to: '17:00' },
          { from: '09:00', to: '12:00' },
        ],
        sat: [],
      },
      daysOff: ['2027-01-06', '2027-01-05', '2027-01-06'],
    };
    const saved = await hoursOf(f.sid, f.sid.membership.id, 'PUT', body);
    expect(saved.status).toBe(200);
    const expected = {
      membershipId: f.sid.membership.id,
      name: 'Sid',
      weekly: { mon: body.weekly.mon },
      // Days off are kept once each, in date order; a day with no ranges is not kept.
      daysOff: ['2027-01-05', '2027-01-06'],
    };
    expect(await saved.json()).toEqual(expected);
    expect(await (await hoursOf(f.sid, f.sid.membership.id)).json()).toEqual(expected);

    // Saving again replaces the row rather than adding one.
    expect((await hoursOf(f.sid, f.sid.membership.id, 'PUT', { weekly: weekdays([{ from: '09:00', to: '11:00' }]), daysOff: [] })).status).toBe(200);
    const slots = await callAsStaff(slotsRoute.GET, f.sid, { em: em(), method: 'GET', path: `/api/app/visits/slots?salespersonId=${f.sid.membership.id}` });
    const starts = (await slots.json()).slots.map((s: { start: string }) => s.start);
    // Monday 09:00–11:00 EST with 60-minute visits every 30 minutes: 09:00, 09:30, 10:00 (14:00Z, 14:30Z, 15:00Z).
    expect(starts.slice(0, 3)).toEqual(['2027-01-04T14:00:00.000Z', '2027-01-04T14:30:00.000Z', '2027-01-04T15:00:00.000Z']);
    expect(starts[3]).toBe('2027-01-05T14:00:00.000Z');
  });

  test('the owner edits anyone’s hours; a salesperson may not read or change another’s (403)', async () => {
    const f = await firm();
    const body = { weekly: weekdays([{ from: '08:00', to: '16:00' }]), daysOff: [] };
    expect((await hoursOf(f.owner, f.ruth.membership.id, 'PUT', body)).status).toBe(200);
    expect((await (await hoursOf(f.owner, f.ruth.membership.id)).json()).weekly.fri).toEqual([{ from: '08:00', to: '16:00' }]);
    const read = await hoursOf(f.sid, f.ruth.membership.id);
    expect(read.status).toBe(403);
    expect(await read.json()).toHaveProperty('error');
    expect((await hoursOf(f.sid, f.ruth.membership.id, 'PUT', { weekly: {}, daysOff: [] })).status).toBe(403);
    expect((await hoursOf(f.sid, f.owner.membership.id, 'PUT', { weekly: {}, daysOff: [] })).status).toBe(403);
    // Ruth's hours are as the owner left them.
    expect((await (await hoursOf(f.ruth, f.ruth.membership.id)).json()).weekly.mon).toEqual([{ from: '08:00', to: '16:00' }]);
  });

  test('another firm’s person is not found (404), and so is an id that is not one; signed out is 401', async () => {
    const f = await firm();
    const other = await firm();
    expect((await hoursOf(other.owner, f.sid.membership.id)).status).toBe(404);
    expect((await hoursOf(other.owner, f.sid.membership.id, 'PUT', { weekly: {}, daysOff: [] })).status).toBe(404);
    expect((await hoursOf(f.owner, 'not-an-id')).status).toBe(404);
    expect((await hoursOf(null, f.sid.membership.id)).status).toBe(401);
  });

  test('bad hours are a 400 naming each field', async () => {
    const f = await firm();
    const bad = await hoursOf(f.sid, f.sid.membership.id, 'PUT', {
      weekly: {
        mon: [{ from: '12:00', to: '09:00' }],
        tue: [
          { from: '09:00', to: '12:00' },
          { from: '11:00', to: '14:00' },
        ],
        wed: [{ from: '09:00', to: '25:00' }],
      },
      daysOff: ['24/12/2027'],
    });
    expect(bad.status).toBe(400);
    expect((await bad.json()).fields).toEqual({
      'weekly.mon.0.to': 'The end must be after the start.',
      'weekly.tue.1.from': 'This range overlaps another on the same day.',
      'weekly.wed.0.to': 'Use a time like 17:00.',
      'daysOff.0': 'Use a date like 2026-12-24.',
    });
    const unknownDay = await hoursOf(f.sid, f.sid.membership.id, 'PUT', { weekly: { funday: [] }, daysOff: [] });
    expect(unknownDay.status).toBe(400);
    // Nothing was stored.
    expect((await (await hoursOf(f.sid, f.sid.membership.id)).json()).weekly).toEqual({});
  });
});

const settings = (as: StaffCaller, body: unknown) => callAsStaff(settingsRoute.PUT, as, { em: em(), method: 'PUT', path: '/api/app/settings/visits', body });
const goodSettings = {
  visitMinutes: 90,
  bufferMinutes: 15,
  stepMinutes: 15,
  minNoticeMinutes: 120,
  horizonDays: 21,
  onlineBooking: true,
  timeZone: 'Europe/London',
};

describe('the firm’s visit settings', () => {
  test('the owner saves them with the time zone; sales get 404 (Setup is the owner’s)', async () => {
    const f = await firm();
    const saved = await settings(f.owner, goodSettings);
    expect(saved.status).toBe(200);
    expect(await saved.json()).toEqual(goodSettings);
    const company = await em().findOneOrFail(Company, { id: f.company.id });
    expect([company.visitMinutes, company.visitBufferMinutes, company.visitStepMinutes, company.visitMinNoticeMinutes, company.visitHorizonDays]).toEqual([
      90, 15, 15, 120, 21,
    ]);
    expect([company.onlineBooking, company.timeZone]).toEqual([true, 'Europe/London']);
    expect((await settings(f.sid, goodSettings)).status).toBe(404);
  });

  test('an unknown time zone and out-of-range minutes are a 400 naming the fields, and nothing changes', async () => {
    const f = await firm();
    const bad = await settings(f.owner, { ...goodSettings, timeZone: 'Mars/Olympus_Mons', visitMinutes: 5, stepMinutes: 'thirty' });
    expect(bad.status).toBe(400);
    const fields = (await bad.json()).fields;
    expect(Object.keys(fields).sort()).toEqual(['stepMinutes', 'timeZone', 'visitMinutes']);
    expect(fields.timeZone).toMatch(/time zone/);
    expect((await em().findOneOrFail(Company, { id: f.company.id })).timeZone).toBe('America/New_York');
  });
});

const calendar = (as: StaffCaller, query: Record<string, string>) =>
  callAsStaff(calendarRoute.GET, as, { em: em(), method: 'GET', path: `/api/app/visits?${new URLSearchParams(query)}` });

describe('the calendar', () => {
  test('lists the firm’s visits in the range with the inquiry and the salesperson, leaving cancelled ones and other firms out', async () => {
    clock = useFakeClock('2027-01-04T12:00:00Z');
    const f = await firm();
    const other = await firm();
    const fork = em();
    const [kept, dropped, elsewhere] = [
      buildLead(fork, f.company.id, { name: 'Hal Brooks' }),
      buildLead(fork, f.company.id),
      buildLead(fork, other.company.id),
    ];
    await fork.flush();
    for (const x of [f, other]) {
      for (const who of [x.sid, x.ruth]) await hoursOf(x.owner, who.membership.id, 'PUT', { weekly: weekdays([{ from: '09:00', to: '17:00' }]), daysOff: [] });
    }
    const book = (as: StaffCaller, leadId: string, body: unknown) =>
      callAsStaff(bookRoute.POST, as, { em: em(), method: 'POST', path: `/api/app/leads/${leadId}/visits`, params: { id: leadId }, body });
    const visit = await (await book(f.sid, kept.id, { start: '2027-01-05T14:00:00.000Z', salespersonId: f.sid.membership.id })).json();
    const gone = await (await book(f.sid, dropped.id, { start: '2027-01-06T14:00:00.000Z', salespersonId: f.ruth.membership.id })).json();
    await callAsStaff(cancelRoute.POST, f.sid, { em: em(), method: 'POST', path: `/api/app/visits/${gone.id}/cancel`, params: { id: gone.id } });
    expect((await book(other.sid, elsewhere.id, { start: '2027-01-05T14:00:00.000Z', salespersonId: other.sid.membership.id })).status).toBe(201);

    // Monday 4 January 00:00 EST to the next Monday 00:00 EST.
    const week = { from: '2027-01-04T05:00:00.000Z', to: '2027-01-11T05:00:00.000Z' };
    const answer = await calendar(f.sid, week);
    expect(answer.status).toBe(200);
    expect((await answer.json()).visits).toEqual([
      {
        id: visit.id,
        leadId: kept.id,
        leadName: 'Hal Brooks',
        reference: kept.reference,
        address: '1 Test Lane',
        postcode: '78704',
        salespersonId: f.sid.membership.id,
        salespersonName: 'Sid',
        start: '2027-01-05T14:00:00.000Z',
        end: '2027-01-05T15:00:00.000Z',
        status: 'booked',
        note: null,
      },
    ]);
    // One person's calendar, and a range that ends where the visit starts (half-open).
    expect((await (await calendar(f.sid, { ...week, salespersonId: f.ruth.membership.id })).json()).visits).toEqual([]);
    expect((await (await calendar(f.sid, { from: week.from, to: '2027-01-05T14:00:00.000Z' })).json()).visits).toEqual([]);
    // Another firm's owner asking for this firm's salesperson sees nothing of this firm.
    expect((await (await calendar(other.owner, { ...week, salespersonId: f.sid.membership.id })).json()).visits).toEqual([]);
  });

  test('a range longer than 42 days, backwards or malformed is a 400 naming the field', async () => {
    const f = await firm();
    const long = await calendar(f.owner, { from: '2027-01-01T00:00:00.000Z', to: '2027-02-12T00:00:01.000Z' });
    expect(long.status).toBe(400);
    expect((await long.json()).fields).toEqual({ to: 'Ask for at most 42 days at once.' });
    expect((await calendar(f.owner, { from: '2027-01-01T00:00:00.000Z', to: '2027-02-12T00:00:00.000Z' })).status).toBe(200);
    const backwards = await calendar(f.owner, { from: '2027-01-08T00:00:00.000Z', to: '2027-01-01T00:00:00.000Z' });
    expect((await backwards.json()).fields).toEqual({ to: 'The end must be after the start.' });
    const malformed = await calendar(f.owner, { from: 'monday', to: '2027-01-01T00:00:00.000Z', salespersonId: 'sid' });
    expect(malformed.status).toBe(400);
    expect(Object.keys((await malformed.json()).fields).sort()).toEqual(['from', 'salespersonId']);
  });
});
