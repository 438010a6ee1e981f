import { randomBytes } from 'node:crypto';
import { afterAll, afterEach, beforeAll, describe, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import { getOrm } from '../../src/lib/server/boot/orm';
import { Availability } from '../../src/lib/server/visits/availability.entity';
import { Visit } from '../../src/lib/server/visits/visit.entity';
import { Lead } from '../../src/lib/server/leads/lead.entity';
import { newViewKey, viewKeyDigest } from '../../src/lib/server/leads/lead-view-keys';
import type { Company } from '../../src/lib/server/companies/company.entity';
import { Membership } from '../../src/lib/server/users/membership.entity';
import * as slotsRoute from '../../src/pages/api/embed/[slug]/slots';
import * as visitsRoute from '../../src/pages/api/embed/[slug]/visits';
import { buildFirm } from '../helpers/accounts';
import { buildLead } from '../helpers/factories';
import { callRoute } from '../helpers/api-route';
import { useFakeClock } from '../helpers/fake-clock';

// The widget's visit step. The rules checked here (minimum notice, horizon, days off, a travel
// buffer, each start once for the public) are Lapwing's own (issue 12); wall-clock times are read
// with the IANA tz database: America/Chicago is CST, UTC−6, in January (docs/sources.md §70); zone names: docs/sources.md §71.

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

/** Monday 4 January 2027, 09:00 CST. */
const MONDAY_9AM = '2027-01-04T15:00:00Z';
const ALLOWED_SITE = 'https://www.oakline-trim.test';

/**
 * A Chicago firm: Sid and Ruth take visits Monday to Friday 09:00–12:00, both off on Wednesday 6
 * January; Thea only on Saturdays 10:00–12:00. One-hour visits every 30 minutes, 30 minutes' travel,
 * a day's notice, a week ahead.
 */
async function firmWithHours(settings: Partial<Pick<Company, 'onlineBooking'>> & { hours?: boolean } = {}) {
  const fork = em();
  const firm = await buildFirm(
    fork,
    [
      { name: 'Opal', role: 'owner' },
      { name: 'Sid', role: 'sales' },
      { name: 'Ruth', role: 'sales' },
      { name: 'Thea', role: 'sales' },
    ],
    { timeZone: 'America/Chicago' },
  );
  Object.assign(firm.company, {
    visitMinutes: 60,
    visitBufferMinutes: 30,
    visitStepMinutes: 30,
    visitMinNoticeMinutes: 24 * 60,
    visitHorizonDays: 7,
    onlineBooking: settings.onlineBooking ?? true,
    embedOrigins: [ALLOWED_SITE],
  });
  if (settings.hours !== false) {
    const morning = [{ from: '09:00', to: '12:00' }];
    for (const person of firm.members.slice(1, 3)) {
      fork.create(Availability, {
        company: firm.company,
        membership: person.membership,
        weekly: { mon: morning, tue: morning, wed: morning, thu: morning, fri: morning },
        daysOff: ['2027-01-06'],
      });
    }
    fork.create(Availability, { company: firm.company, membership: firm.members[3]!.membership, weekly: { sat: [{ from: '10:00', to: '12:00' }] } });
  }
  await fork.flush();
  const [, sid, ruth, thea] = firm.members.map((m) => m.membership.id);
  return { company: firm.company, slug: firm.company.slug, sid: sid!, ruth: ruth!, thea: thea! };
}

/** An inquiry of the firm and the key of its private estimate link, as the widget receives them. */
async function inquiryOf(companyId: string, assigneeId?: string) {
  const fork = em();
  const key = newViewKey();
  const lead = buildLead(fork, companyId);
  lead.viewTokenHash = viewKeyDigest(key);
  if (assigneeId) lead.assignee = fork.getReference(Membership, assigneeId);
  await fork.flush();
  return { lead: lead.id, key };
}

const address = () => `203.0.113.${Math.floor(Math.random() * 250) + 1}-${randomBytes(3).toString('hex')}`;

function slots(slug: string, query = '', options: { clientAddress?: string; headers?: Record<string, string> } = {}) {
  return callRoute(slotsRoute.GET, {
    method: 'GET',
    path: `/api/embed/${slug}/slots${query}`,
    params: { slug },
    em: em(),
    clientAddress: address(),
    ...options,
  });
}

function book(slug: string, body: unknown, options: { clientAddress?: string; headers?: Record<string, string> } = {}) {
  return callRoute(visitsRoute.POST, {
    method: 'POST',
    path: `/api/embed/${slug}/visits`,
    params: { slug },
    em: em(),
    body,
    clientAddress: address(),
    ...options,
  });
}

/** UTC starts for 09:00, 09:30 … 11:00 CST on a January day: the last start that ends by 12:00 is 11:00. */
const mornings = (day: number) => ['15:00', '15:30', '16:00', '16:30', '17:00'].map((t) => `2027-01-${String(day).padStart(2, '0')}T${t}:00.000Z`);

describe('GET /api/embed/SLUG/slots', () => {
  test('the team’s open times, each once, from a day’s notice to a week ahead, without days off, and with no staff in the answer', async () => {
    clock = useFakeClock(MONDAY_9AM);
    const firm = await firmWithHours();
    const answer = await slots(firm.slug);
    expect(answer.status).toBe(200);
    const body = await answer.json();
    expect(body).toMatchObject({ offered: true, timeZone: 'America/Chicago', zoneLabel: 'Central Time (CST)' });
    // Tuesday 09:00 CST is exactly a day after now (kept); Wednesday is everyone's day off; Saturday
    // is Thea's 10:00–12:00; Monday the 11th is the last date within the week; Tuesday the 12th is past it.
    const saturday = ['2027-01-09T16:00:00.000Z', '2027-01-09T16:30:00.000Z', '2027-01-09T17:00:00.000Z'];
    expect(body.slots.map((s: { start: string }) => s.start)).toEqual([...mornings(5), ...mornings(7), ...mornings(8), ...saturday, ...mornings(11)]);
    for (const slot of body.slots) {
      expect(Object.keys(slot).sort()).toEqual(['end', 'start']);
      expect(new Date(slot.end).getTime() - new Date(slot.start).getTime()).toBe(60 * 60_000);
    }
    const text = JSON.stringify(body);
    for (const id of [firm.sid, firm.ruth, firm.thea]) expect(text).not.toContain(id);
    expect(text).not.toMatch(/Sid|Ruth|Thea/);
  });

  test('a proven inquiry with an assignee who has hours gets that person’s times; a wrong key is a 404', async () => {
    clock = useFakeClock(MONDAY_9AM);
    const firm = await firmWithHours();
    const inquiry = await inquiryOf(firm.company.id, firm.thea);
    const own = await (await slots(firm.slug, `?lead=${inquiry.lead}&key=${inquiry.key}`)).json();
    expect(own.slots.map((s: { start: string }) => s.start)).toEqual(['2027-01-09T16:00:00.000Z', '2027-01-09T16:30:00.000Z', '2027-01-09T17:00:00.000Z']);
    expect(JSON.stringify(own)).not.toContain(firm.thea);

    expect((await slots(firm.slug, `?lead=${inquiry.lead}&key=${newViewKey()}`)).status).toBe(404);
    expect((await slots(firm.slug, `?lead=not-an-id&key=${inquiry.key}`)).status).toBe(404);
  });

  test('not offered when the firm does not book online, or nobody has hours', async () => {
    clock = useFakeClock(MONDAY_9AM);
    const off = await firmWithHours({ onlineBooking: false });
    expect(await (await slots(off.slug)).json()).toEqual({ offered: false, slots: [] });
    const noHours = await firmWithHours({ hours: false });
    expect(await (await slots(noHours.slug)).json()).toEqual({ offered: false, slots: [] });
  });

  test('too many calls from one address get 429 with Retry-After', async () => {
    const firm = await firmWithHours();
    const clientAddress = address();
    for (let i = 0; i < 30; i++) expect((await slots(firm.slug, '', { clientAddress })).status).toBe(200);
    const refused = await slots(firm.slug, '', { clientAddress });
    expect(refused.status).toBe(429);
    expect(Number(refused.headers.get('retry-after'))).toBeGreaterThan(0);
  });
});

describe('POST /api/embed/SLUG/visits', () => {
  test('the homeowner books a time for their inquiry: 201 with the visit, the inquiry moves to Visit booked, and no more times are offered to it', async () => {
    clock = useFakeClock(MONDAY_9AM);
    const firm = await firmWithHours();
    const inquiry = await inquiryOf(firm.company.id);
    const answer = await book(firm.slug, { ...inquiry, start: '2027-01-05T15:00:00.000Z', note: 'Gate code 4412' });
    expect(answer.status).toBe(201);
    expect(await answer.json()).toEqual({ visit: { start: '2027-01-05T15:00:00.000Z', end: '2027-01-05T16:00:00.000Z', timeZone: 'America/Chicago' } });

    const visit = await em().findOneOrFail(Visit, { lead: inquiry.lead });
    expect([visit.bookedVia, visit.bookedBy, visit.note, visit.status]).toEqual(['widget', null, 'Gate code 4412', 'booked']);
    expect([firm.sid, firm.ruth]).toContain(visit.salesperson?.id);
    const lead = await em().findOneOrFail(Lead, { id: inquiry.lead });
    expect([lead.stage, lead.assignee?.id]).toEqual(['visit-booked', visit.salesperson?.id]);
    expect(await (await slots(firm.slug, `?lead=${inquiry.lead}&key=${inquiry.key}`)).json()).toEqual({ offered: false, slots: [] });
  });

  test('a time just taken by everyone is a 409 with the next open times, each once and with no staff ids', async () => {
    clock = useFakeClock(MONDAY_9AM);
    const firm = await firmWithHours();
    const start = '2027-01-05T15:00:00.000Z'; // Tuesday 09:00 CST
    // Sid and Ruth are both free then: two inquiries get it, the third does not.
    for (let i = 0; i < 2; i++) expect((await book(firm.slug, { ...(await inquiryOf(firm.company.id)), start })).status).toBe(201);
    const third = await inquiryOf(firm.company.id);
    const refused = await book(firm.slug, { ...third, start });
    expect(refused.status).toBe(409);
    const body = await refused.json();
    expect(body.error).toMatch(/no longer open|just booked/);
    // Both visits keep 30 minutes' travel after 10:00, so 10:30 CST is next; each start appears once.
    expect(body.alternatives[0]).toEqual({ start: '2027-01-05T16:30:00.000Z', end: '2027-01-05T17:30:00.000Z' });
    const starts = body.alternatives.map((s: { start: string }) => s.start);
    expect(new Set(starts).size).toBe(starts.length);
    for (const slot of body.alternatives) expect(Object.keys(slot).sort()).toEqual(['end', 'start']);
    expect(JSON.stringify(body)).not.toMatch(new RegExp([firm.sid, firm.ruth, firm.thea].join('|')));
    expect(await em().count(Visit, { lead: third.lead })).toBe(0);
  });

  test('a wrong key, an unknown inquiry or another firm’s address for the inquiry is a 404, and nothing is booked', async () => {
    clock = useFakeClock(MONDAY_9AM);
    const firm = await firmWithHours();
    const other = await firmWithHours();
    const inquiry = await inquiryOf(firm.company.id);
    const start = '2027-01-05T15:00:00.000Z';
    expect((await book(firm.slug, { ...inquiry, key: newViewKey(), start })).status).toBe(404);
    expect((await book(firm.slug, { lead: crypto.randomUUID(), key: inquiry.key, start })).status).toBe(404);
    expect((await book(firm.slug, { lead: 'RECEIVED', key: inquiry.key, start })).status).toBe(404);
    // The right inquiry and key, but through another firm's widget.
    const crossFirm = await book(other.slug, { ...inquiry, start });
    expect(crossFirm.status).toBe(404);
    expect(await crossFirm.json()).toEqual({ error: expect.stringMatching(/could not find that inquiry/) });
    expect(await em().count(Visit, { lead: inquiry.lead })).toBe(0);
  });

  test('bad input is a 400 naming the field, and the public cannot choose a salesperson', async () => {
    clock = useFakeClock(MONDAY_9AM);
    const firm = await firmWithHours();
    const inquiry = await inquiryOf(firm.company.id);
    const badStart = await book(firm.slug, { ...inquiry, start: 'tomorrow morning' });
    expect(badStart.status).toBe(400);
    expect((await badStart.json()).fields).toHaveProperty('start');
    const longNote = await book(firm.slug, { ...inquiry, start: '2027-01-05T15:00:00.000Z', note: 'x'.repeat(501) });
    expect((await longNote.json()).fields).toHaveProperty('note');
    const naming = await book(firm.slug, { ...inquiry, start: '2027-01-05T15:00:00.000Z', salespersonId: firm.sid });
    expect(naming.status).toBe(400);
    const notJson = await book(firm.slug, 'start=soon', { headers: { 'content-type': 'text/plain' } });
    expect(notJson.status).toBe(415);
    expect(await em().count(Visit, { lead: inquiry.lead })).toBe(0);
  });

  test('a firm that does not book online refuses with a message, whatever the time', async () => {
    clock = useFakeClock(MONDAY_9AM);
    const firm = await firmWithHours({ onlineBooking: false });
    const inquiry = await inquiryOf(firm.company.id);
    const refused = await book(firm.slug, { ...inquiry, start: '2027-01-05T15:00:00.000Z' });
    expect(refused.status).toBe(403);
    expect((await refused.json()).error).toMatch(/arranges visits by phone/);
  });

  test('too many bookings from one address get 429 with Retry-After', async () => {
    const firm = await firmWithHours();
    const inquiry = await inquiryOf(firm.company.id);
    const clientAddress = address();
    const wrong = { ...inquiry, key: newViewKey(), start: '2027-01-05T15:00:00.000Z' };
    for (let i = 0; i < 10; i++) expect((await book(firm.slug, wrong, { clientAddress })).status).toBe(404);
    const refused = await book(firm.slug, wrong, { clientAddress });
    expect(refused.status).toBe(429);
    expect(Number(refused.headers.get('retry-after'))).toBeGreaterThan(0);
  });
});

describe('CORS for the firm’s own sites', () => {
  test('a preflight from an allowed site is answered for it; another site is refused', async () => {
    const firm = await firmWithHours();
    const preflight = await callRoute(visitsRoute.OPTIONS, {
      method: 'OPTIONS',
      path: `/api/embed/${firm.slug}/visits`,
      params: { slug: firm.slug },
      em: em(),
      headers: { origin: ALLOWED_SITE, 'access-control-request-method': 'POST', 'access-control-request-headers': 'content-type' },
    });
    expect(preflight.status).toBe(204);
    expect(preflight.headers.get('access-control-allow-origin')).toBe(ALLOWED_SITE);
    expect(preflight.headers.get('access-control-allow-methods')).toContain('POST');
    expect(preflight.headers.get('access-control-allow-headers')).toMatch(/content-type/i);

    const fromSite = await slots(firm.slug, '', { headers: { origin: ALLOWED_SITE } });
    expect(fromSite.status).toBe(200);
    expect(fromSite.headers.get('access-control-allow-origin')).toBe(ALLOWED_SITE);
    const foreign = await slots(firm.slug, '', { headers: { origin: 'https://elsewhere.test' } });
    expect(foreign.status).toBe(403);
    expect(foreign.headers.get('access-control-allow-origin')).toBeNull();
  });
});
