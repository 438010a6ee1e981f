import { afterAll, afterEach, beforeAll, describe, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import { experimental_AstroContainer as AstroContainer } from 'astro/container';
import { getContainerRenderer } from '@astrojs/react';
import { loadRenderers } from 'astro:container';
import { getOrm } from '../../src/lib/server/boot/orm';
import { Lead } from '../../src/lib/server/leads/lead.entity';
import { LeadEvent } from '../../src/lib/server/leads/lead-event.entity';
import { OutboxMail } from '../../src/lib/server/mail/outbox-mail.entity';
import { Visit } from '../../src/lib/server/visits/visit.entity';
import { visitIdOfToken, visitLinkToken } from '../../src/lib/server/visits/visit-link';
import * as moveRoute from '../../src/pages/api/visit/[token]/move';
import * as cancelRoute from '../../src/pages/api/visit/[token]/cancel';
import VisitPage from '../../src/pages/visit/[token].astro';
import { callRoute } from '../helpers/api-route';
import { useFakeClock } from '../helpers/fake-clock';
import { textOf } from '../helpers/staff-pages';
import { bookAsStaff, visitFirm, visitLead } from '../helpers/visit-firm';

// Times: IANA tz database, America/New_York is UTC−5 (EST) in January. The link's signature is
// HMAC-SHA256 (Source: RFC 2104 HMAC, FIPS 180-4 SHA-256), written in base64url without padding
// (Source: RFC 4648 §5): 43 characters for 32 bytes.

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

const ORIGIN = 'http://127.0.0.1:4321';
let addresses = 0;
/** A caller address of its own per test, so one test's calls never use up another's. */
const newAddress = () => `198.51.100.${++addresses}`;

let container: AstroContainer | undefined;
async function openPage(token: string): Promise<{ status: number; headers: Headers; text: string }> {
  container ??= await AstroContainer.create({ renderers: await loadRenderers([getContainerRenderer()]) });
  const response = await container.renderToResponse(VisitPage, {
    locals: { em: em() } as unknown as App.Locals,
    params: { token },
    request: new Request(`${ORIGIN}/visit/${token}`),
  });
  return { status: response.status, headers: response.headers, text: textOf(await response.text()) };
}

function post(route: 'move' | 'cancel', token: string, body: unknown, options: { headers?: Record<string, string>; clientAddress?: string } = {}) {
  const handler = route === 'move' ? moveRoute.POST : cancelRoute.POST;
  return callRoute(handler, {
    em: em(),
    method: 'POST',
    path: `/api/visit/${token}/${route}`,
    params: { token },
    body,
    headers: { origin: ORIGIN, 'sec-fetch-site': 'same-origin', ...options.headers },
    clientAddress: options.clientAddress ?? newAddress(),
  });
}

/** A firm (New York, a day's notice for homeowners) with one visit booked for Tuesday 5 January 2027, 09:00 EST. */
async function bookedVisit() {
  // Monday 4 January 2027, 07:00 EST.
  clock = useFakeClock('2027-01-04T12:00:00Z');
  const firm = await visitFirm(em(), { minNoticeMinutes: 24 * 60 });
  const lead = await visitLead(em(), firm);
  const visit = await bookAsStaff(em(), firm, lead.id, '2027-01-05T14:00:00.000Z');
  return { firm, lead, visit, token: visitLinkToken(visit.id) };
}

describe('the homeowner’s link', () => {
  test('opens a page with the visit on the firm’s clock (labelled with its zone), who comes and where, and sends no referrer', async () => {
    const { firm, token } = await bookedVisit();
    const page = await openPage(token);
    expect(page.status).toBe(200);
    expect(page.headers.get('referrer-policy')).toBe('no-referrer');
    expect(page.headers.get('cache-control')).toBe('no-store');
    expect(page.text).toContain('Tue, Jan 5, 2027, 9:00 AM EST');
    expect(page.text).toContain('America/New_York');
    expect(page.text).toContain(`Sid from ${firm.company.name}`);
    expect(page.text).toContain('12 Alder Row, 10027');
    expect(page.text).toContain('Choose another time');
    expect(page.text).toContain('Cancel the visit');
  });

  test('a forged token, another visit’s signature or a cut-short link opens a 404 that names no firm', async () => {
    const { firm, visit, token } = await bookedVisit();
    const other = await bookAsStaff(em(), firm, (await visitLead(em(), firm)).id, '2027-01-05T18:00:00.000Z');
    const signature = token.split('.')[1]!;
    const forged = [
      `${visit.id}.${'A'.repeat(43)}`,
      `${other.id}.${signature}`,
      visit.id,
      token.slice(0, -1),
      `${token}x`,
      `${visit.id}.${signature.replace(/^./, (c) => (c === 'a' ? 'b' : 'a'))}`,
      'not-a-token',
      `00000000-0000-4000-8000-000000000000.${signature}`,
    ];
    for (const bad of forged) {
      expect(visitIdOfToken(bad), bad).toBeNull();
      const page = await openPage(bad);
      expect(page.status, bad).toBe(404);
      expect(page.text).toContain('This link does not open a visit');
      expect(page.text).not.toContain(firm.company.name);
      const answer = await post('move', bad, { start: '2027-01-06T15:00:00.000Z' });
      expect(answer.status, bad).toBe(404);
    }
    expect(visitIdOfToken(token)).toBe(visit.id);
  });

  test('expires after the visit: once it has ended the page says so with the firm’s phone, and changes are refused (410)', async () => {
    const { firm, token } = await bookedVisit();
    // Tuesday 10:00 EST: the visit (09:00–10:00) has just ended.
    clock!.set('2027-01-05T15:00:00Z');
    const page = await openPage(token);
    expect(page.text).toContain('This visit is over');
    expect(page.text).toContain(firm.company.phone!);
    expect(page.text).not.toContain('Choose another time');
    const move = await post('move', token, { start: '2027-01-06T15:00:00.000Z' });
    expect(move.status).toBe(410);
    expect((await move.json()).error).toContain(firm.company.phone!);
    // While it is under way it is shown, but no longer changed here.
    clock!.set('2027-01-05T14:30:00Z');
    expect((await openPage(token)).text).toContain('has started');
    expect((await post('cancel', token, {})).status).toBe(410);
  });

  test('the homeowner moves the visit to an offered time; one inside the firm’s notice is refused with the open times', async () => {
    const { firm, lead, visit, token } = await bookedVisit();
    // Monday 15:00 EST is inside the firm's day of notice.
    const early = await post('move', token, { start: '2027-01-04T20:00:00.000Z' });
    expect(early.status).toBe(409);
    const refusal = await early.json();
    // The next open time after it: Tuesday 10:00 EST (the visit's own 09:00 is left out).
    expect(refusal.alternatives[0]).toEqual({ start: '2027-01-05T15:00:00.000Z', end: '2027-01-05T16:00:00.000Z', salespersonId: firm.sid.membership.id });

    const moved = await post('move', token, { start: '2027-01-06T15:00:00.000Z' }); // Wednesday 10:00 EST
    expect(moved.status).toBe(200);
    expect(await moved.json()).toMatchObject({ state: 'open', start: '2027-01-06T15:00:00.000Z', salespersonName: 'Sid' });
    const stored = await em().findOneOrFail(Visit, { id: visit.id });
    expect([stored.startsAt.toISOString(), stored.sequence, stored.status]).toEqual(['2027-01-06T15:00:00.000Z', 1, 'booked']);
    const event = await em().findOneOrFail(LeadEvent, { lead: lead.id, kind: 'visit', data: { action: 'moved' } });
    expect(event.data).toMatchObject({ by: 'homeowner', at: '2027-01-06T15:00:00.000Z' });
    // Both get the changed invitation.
    expect(await em().count(OutboxMail, { toAddress: { $in: [lead.email, firm.sid.email] }, subject: { $like: '%moved%' } })).toBe(2);
    // The same link still works, for the new time.
    expect((await openPage(token)).text).toContain('Wed, Jan 6, 2027, 10:00 AM EST');
  });

  test('the homeowner cancels: the visit is cancelled by the homeowner, the inquiry goes back a stage, and the link says so', async () => {
    const { firm, lead, visit, token } = await bookedVisit();
    const cancelled = await post('cancel', token, {});
    expect(cancelled.status).toBe(200);
    expect(await cancelled.json()).toMatchObject({ state: 'cancelled', slots: [] });
    const stored = await em().findOneOrFail(Visit, { id: visit.id });
    expect([stored.status, stored.cancelledBy, stored.sequence]).toEqual(['cancelled', 'homeowner', 1]);
    expect((await em().findOneOrFail(Lead, { id: lead.id })).stage).toBe('spoken-to');
    const page = await openPage(token);
    expect(page.text).toContain('This visit is cancelled');
    expect(page.text).toContain(firm.company.phone!);
    expect((await post('move', token, { start: '2027-01-06T15:00:00.000Z' })).status).toBe(410);
    expect((await post('cancel', token, {})).status).toBe(410);
  });

  test('refuses posts from other sites, and posts without our Origin, before changing anything', async () => {
    const { visit, token } = await bookedVisit();
    // Source: OWASP CSRF Prevention Cheat Sheet, "Fetch Metadata" and "Verifying Origin With Standard Headers".
    const attempts: Record<string, string>[] = [
      { origin: 'https://elsewhere.test', 'sec-fetch-site': 'cross-site' },
      { origin: ORIGIN, 'sec-fetch-site': 'cross-site' },
      { origin: 'null' },
      { origin: '' },
    ];
    for (const headers of attempts) {
      const answer = await post('cancel', token, {}, { headers });
      expect(answer.status, JSON.stringify(headers)).toBe(403);
    }
    expect((await em().findOneOrFail(Visit, { id: visit.id })).status).toBe('booked');
  });

  test('bad input is a 400 naming the field; too many calls for one visit get a 429 with Retry-After', async () => {
    const { token } = await bookedVisit();
    const bad = await post('move', token, { start: 'next tuesday' });
    expect(bad.status).toBe(400);
    expect((await bad.json()).fields).toHaveProperty('start');
    // Ten calls an hour per visit (a product choice, no source): the first was the one above.
    for (let i = 0; i < 9; i++) expect((await post('move', token, { start: 'x' })).status).toBe(400);
    const refused = await post('move', token, { start: 'x' });
    expect(refused.status).toBe(429);
    expect(Number(refused.headers.get('retry-after'))).toBeGreaterThan(0);
  });
});
