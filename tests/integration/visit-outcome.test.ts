import { afterAll, afterEach, beforeAll, describe, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import { estimate, sampleProject, sampleRateBook, type ProjectInput } from '../../src/lib/estimate';
import { getOrm } from '../../src/lib/server/boot/orm';
import { Lead } from '../../src/lib/server/leads/lead.entity';
import { LeadEvent } from '../../src/lib/server/leads/lead-event.entity';
import { leadInputs } from '../../src/lib/server/leads/lead-inputs';
import { estimateSnapshot } from '../../src/lib/server/estimates/estimate-snapshot';
import { Visit } from '../../src/lib/server/visits/visit.entity';
import * as outcomeRoute from '../../src/pages/api/app/visits/[id]/outcome';
import * as measuredRoute from '../../src/pages/api/app/leads/[id]/measured-rooms';
import { buildFirm } from '../helpers/accounts';
import { buildLead, buildRateBookVersion } from '../helpers/factories';
import { callAsStaff, type StaffCaller } from '../helpers/as-staff';
import { HOUR_MS, useFakeClock } from '../helpers/fake-clock';

// Marking a visit and re-pricing from the measured rooms are Lapwing's own workflow rules; the
// prices are checked against the estimating core's own `estimate()` for the same project.

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

/** A firm with a published sample Rate book, an owner and a salesperson, and one inquiry at Visit booked with a visit. */
async function firmWithVisit(visitStart: string) {
  const fork = em();
  const firm = await buildFirm(
    fork,
    [
      { name: 'Opal', role: 'owner' },
      { name: 'Sid', role: 'sales' },
    ],
    { timeZone: 'America/Chicago' },
  );
  const version = buildRateBookVersion(fork, firm.company.id, { status: 'published' });
  const lead = buildLead(fork, firm.company.id, { rateBookVersion: version });
  lead.stage = 'visit-booked';
  const start = new Date(visitStart);
  const visit = fork.create(Visit, {
    company: firm.company,
    lead,
    salesperson: firm.members[1]!.membership,
    startsAt: start,
    endsAt: new Date(start.getTime() + HOUR_MS),
    blockedUntil: new Date(start.getTime() + 1.5 * HOUR_MS),
    bookedVia: 'staff',
  });
  await fork.flush();
  const as = (i: number): StaffCaller => ({ company: firm.company, user: firm.members[i]!.user, membership: firm.members[i]!.membership });
  return { ...firm, lead, visit, owner: as(0), sid: as(1) };
}

const mark = (as: StaffCaller | null, visitId: string, body: unknown) =>
  callAsStaff(outcomeRoute.POST, as, { em: em(), method: 'POST', path: `/api/app/visits/${visitId}/outcome`, params: { id: visitId }, body });
const measure = (as: StaffCaller | null, leadId: string, body: unknown) =>
  callAsStaff(measuredRoute.PUT, as, { em: em(), method: 'PUT', path: `/api/app/leads/${leadId}/measured-rooms`, params: { id: leadId }, body });
const eventsOf = (leadId: string) => em().find(LeadEvent, { lead: leadId }, { orderBy: { at: 'asc', createdAt: 'asc' } });

// Tuesday 5 January 2027, 09:00 in Chicago (CST, UTC−6). Source: IANA tz database, America/Chicago.
const VISIT_START = '2027-01-05T15:00:00.000Z';

describe('marking a site visit done or no one home', () => {
  test('before the visit starts it is refused with a 409 that says so; nothing changes', async () => {
    clock = useFakeClock('2027-01-05T14:59:00Z');
    const firm = await firmWithVisit(VISIT_START);
    const early = await mark(firm.sid, firm.visit.id, { outcome: 'done' });
    expect(early.status).toBe(409);
    const body = await early.json();
    expect(body.error).toMatch(/not started yet/);
    expect(body.fields.outcome).toBe('The visit starts Tue, Jan 5, 2027, 9:00 AM CST.');
    expect((await em().findOneOrFail(Visit, { id: firm.visit.id })).status).toBe('booked');
  });

  test('a salesperson marks it done once it has begun: status, time and a timeline entry; the stage waits for the measured rooms', async () => {
    clock = useFakeClock('2027-01-05T15:00:00Z');
    const firm = await firmWithVisit(VISIT_START);
    const done = await mark(firm.sid, firm.visit.id, { outcome: 'done' });
    expect(done.status).toBe(200);
    expect(await done.json()).toMatchObject({ id: firm.visit.id, status: 'done' });
    const visit = await em().findOneOrFail(Visit, { id: firm.visit.id });
    expect([visit.status, visit.outcomeAt?.toISOString()]).toEqual(['done', '2027-01-05T15:00:00.000Z']);
    const entry = (await eventsOf(firm.lead.id)).find((e) => e.kind === 'visit');
    expect(entry?.data).toEqual({ action: 'done', visitId: visit.id, at: VISIT_START, text: 'Visit done: Tue, Jan 5, 2027, 9:00 AM CST with Sid' });
    expect((await em().findOneOrFail(Lead, { id: firm.lead.id })).stage).toBe('visit-booked');
    // Marked once: a second outcome is refused.
    expect((await mark(firm.owner, firm.visit.id, { outcome: 'no-show' })).status).toBe(409);
  });

  test('no one home keeps the stage, so the visit can be booked again', async () => {
    clock = useFakeClock('2027-01-05T16:30:00Z');
    const firm = await firmWithVisit(VISIT_START);
    const answer = await mark(firm.owner, firm.visit.id, { outcome: 'no-show' });
    expect(answer.status).toBe(200);
    expect((await em().findOneOrFail(Visit, { id: firm.visit.id })).status).toBe('no-show');
    expect((await em().findOneOrFail(Lead, { id: firm.lead.id })).stage).toBe('visit-booked');
    const entry = (await eventsOf(firm.lead.id)).find((e) => e.kind === 'visit');
    expect(entry?.data.text).toBe('No one home for the visit of Tue, Jan 5, 2027, 9:00 AM CST with Sid');
  });

  test('bad input is a 400 naming the field; signed out 401; another firm’s staff get 404 and change nothing', async () => {
    clock = useFakeClock('2027-01-05T16:00:00Z');
    const firm = await firmWithVisit(VISIT_START);
    const stranger = await firmWithVisit(VISIT_START);
    const bad = await mark(firm.sid, firm.visit.id, { outcome: 'maybe' });
    expect(bad.status).toBe(400);
    expect((await bad.json()).fields).toEqual({ outcome: 'Choose done or no one home.' });
    expect((await mark(null, firm.visit.id, { outcome: 'done' })).status).toBe(401);
    expect((await mark(stranger.owner, firm.visit.id, { outcome: 'done' })).status).toBe(404);
    expect((await mark(stranger.sid, firm.visit.id, { outcome: 'maybe' })).status).toBe(404);
    expect((await mark(firm.sid, 'not-an-id', { outcome: 'done' })).status).toBe(404);
    expect((await em().findOneOrFail(Visit, { id: firm.visit.id })).status).toBe('booked');
  });
});

describe('the measured rooms', () => {
  /** The sample project as the salesperson measured it: the dining room turned out 4 in longer. */
  function measuredRooms(): ProjectInput {
    const project = sampleProject();
    project.rooms[0]!.length = 160;
    return project;
  }

  test('are refused until a visit is done', async () => {
    clock = useFakeClock('2027-01-05T16:00:00Z');
    const firm = await firmWithVisit(VISIT_START);
    const answer = await measure(firm.sid, firm.lead.id, { project: measuredRooms() });
    expect(answer.status).toBe(409);
    expect((await answer.json()).error).toMatch(/Mark the site visit done first/);
  });

  test('re-price the inquiry as a site measurement: a narrower range, stage Measured, the earlier estimate in the timeline', async () => {
    clock = useFakeClock('2027-01-05T16:00:00Z');
    const firm = await firmWithVisit(VISIT_START);
    expect((await mark(firm.sid, firm.visit.id, { outcome: 'done' })).status).toBe(200);
    const before = await em().findOneOrFail(Lead, { id: firm.lead.id }, { populate: ['estimate'] });
    const earlier = estimateSnapshot.read(before.estimate);

    clock.advance(HOUR_MS);
    // As the form sends them: no photos or trip zone (the server keeps the inquiry's), any measuredBy.
    const { tripZone: _tripZone, ...sent } = { ...measuredRooms(), photoCount: 0, measuredBy: 'homeowner-estimate' as const };
    const answer = await measure(firm.sid, firm.lead.id, { project: sent });
    expect(answer.status).toBe(200);
    const body = await answer.json();
    expect(body.timeline.state.stage).toBe('measured');

    // Source: the estimating core's own estimate() of the same rooms, once as the homeowner's tape
    // measure and once as a site measurement, with the sample Rate book (its spreads are invented
    // demo numbers; a site measurement having the narrowest is common practice, no source).
    const rates = sampleRateBook();
    const asHomeowner = estimate({ ...measuredRooms(), measuredBy: 'homeowner-tape' }, rates).price;
    const asSite = estimate({ ...measuredRooms(), measuredBy: 'site-measure' }, rates).price;
    expect(asSite.subtotalCents).toBe(asHomeowner.subtotalCents);
    expect(body.range).toEqual({ lowCents: asSite.lowCents, highCents: asSite.highCents });
    expect(asSite.highCents - asSite.lowCents).toBeLessThan(asHomeowner.highCents - asHomeowner.lowCents);
    expect(asSite.lowCents).toBeGreaterThanOrEqual(asHomeowner.lowCents);
    expect(asSite.highCents).toBeLessThanOrEqual(asHomeowner.highCents);

    const lead = await em().findOneOrFail(Lead, { id: firm.lead.id }, { populate: ['estimate'] });
    const stored = leadInputs.read(lead.inputs);
    // The photos and trip zone the inquiry came with stay; the sizes are the measured ones.
    expect([stored.measuredBy, stored.photoCount, stored.tripZone, stored.rooms[0]!.length]).toEqual(['site-measure', 3, 'local', 160]);
    expect(estimateSnapshot.read(lead.estimate).takeoff.facts.measuredBy).toBe('site-measure');
    expect([lead.stage, lead.rangeLowCents, lead.rangeHighCents]).toEqual(['measured', asSite.lowCents, asSite.highCents]);

    const events = await eventsOf(firm.lead.id);
    const repriced = events.find((e) => e.kind === 're-estimated')!;
    expect(repriced.data.before).toEqual({ lowCents: earlier.price.lowCents, highCents: earlier.price.highCents });
    expect(repriced.data.after).toEqual({ lowCents: asSite.lowCents, highCents: asSite.highCents });
    const previous = repriced.data.previous as { inputs: unknown; estimate: unknown };
    expect(estimateSnapshot.read(previous.estimate).price.rangeText).toBe(earlier.price.rangeText);
    expect(leadInputs.read(previous.inputs).rooms[0]!.length).toBe(156);
    expect(repriced.data.text).toBe(`${asSite.rangeText} from a site measurement (was ${earlier.price.rangeText} from the homeowner's tape measure)`);
    const moved = events.filter((e) => e.kind === 'stage-moved').at(-1)!;
    expect(moved.data).toEqual({ from: 'visit-booked', to: 'measured' });
    const shown = body.timeline.events.find((e: { kind: string }) => e.kind === 're-estimated');
    expect([shown.label, shown.text]).toEqual(['Measured and re-priced', repriced.data.text]);
  });

  test('bad rooms are a field-level 400 under project.…; another firm’s staff get 404; nothing changes', async () => {
    clock = useFakeClock('2027-01-05T16:00:00Z');
    const firm = await firmWithVisit(VISIT_START);
    const stranger = await firmWithVisit(VISIT_START);
    expect((await mark(firm.sid, firm.visit.id, { outcome: 'done' })).status).toBe(200);
    const rooms = measuredRooms();
    rooms.rooms[0]!.ceilingHeight = 20;
    const bad = await measure(firm.sid, firm.lead.id, { project: rooms });
    expect(bad.status).toBe(400);
    // Source: the core's project schema (src/lib/estimate/schemas.ts), ceiling heights 60–240 in.
    expect((await bad.json()).fields).toMatchObject({ 'project.rooms.0.ceilingHeight': 'Ceiling height must be at least 60 in.' });
    // A finish the firm's Rate book does not offer is refused with the room's path, as for the phone form.
    const unknown = measuredRooms();
    unknown.rooms[1]!.treatment = { id: 'no-such-finish', height: 'full' };
    const refused = await measure(firm.sid, firm.lead.id, { project: unknown });
    expect(refused.status).toBe(400);
    expect(Object.keys((await refused.json()).fields).some((path) => path.startsWith('project.rooms.1.treatment'))).toBe(true);
    expect((await measure(firm.sid, firm.lead.id, { project: {} })).status).toBe(400);
    expect((await measure(null, firm.lead.id, { project: measuredRooms() })).status).toBe(401);
    expect((await measure(stranger.owner, firm.lead.id, { project: measuredRooms() })).status).toBe(404);
    const lead = await em().findOneOrFail(Lead, { id: firm.lead.id });
    expect([lead.stage, leadInputs.read(lead.inputs).measuredBy]).toEqual(['visit-booked', 'homeowner-tape']);
  });
});
