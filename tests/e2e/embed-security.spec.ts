import { randomUUID } from 'node:crypto';
import { createServer } from 'node:http';
import { expect, test } from '@playwright/test';
import { issueFormToken } from '../../src/lib/server/embed/form-token';
import { query } from '../helpers/app-database';
import { freeLoopbackPort } from '../helpers/ports';
import { asANewVisitor, formTokenFor, twoRoomProject } from './helpers/embed';

const FOREIGN = 'https://not-the-firm.test';

test('a page of another origin cannot frame the widget; the firm’s own demo page can', async ({ page, baseURL }) => {
  // A page of another origin embedding the widget, served for real from another loopback port. (A
  // page fulfilled by page.route counts as a public site, and Chromium's local-network checks would
  // stop its frame before the widget's own policy is ever consulted.)
  const port = await freeLoopbackPort();
  const otherSite = createServer((_request, response) => {
    response
      .writeHead(200, { 'content-type': 'text/html' })
      .end(`<!doctype html><h1>Other site</h1><iframe id="w" src="${baseURL}/embed/cedar-hollow"></iframe>`);
  });
  await new Promise<void>((resolve) => otherSite.listen(port, '127.0.0.1', resolve));
  try {
    // Chromium says why it refused the frame; waiting for that replaces a fixed wait.
    const refused = page.waitForEvent('console', (message) => message.text().includes('frame-ancestors'));
    await page.goto(`http://127.0.0.1:${port}/`);
    expect((await refused).text()).toContain('violates the following Content Security Policy directive');
    await expect(page.frameLocator('#w').getByRole('heading', { name: 'Your rooms' })).toHaveCount(0);
  } finally {
    otherSite.closeAllConnections();
    await new Promise((resolve) => otherSite.close(resolve));
  }

  const response = await page.request.get('/embed/cedar-hollow');
  expect(response.headers()['content-security-policy']).toContain("frame-ancestors 'self'");
  expect(response.headers()['content-security-policy']).not.toContain(FOREIGN);
  expect(response.headers()['content-security-policy']).not.toContain(`:${port}`);
  expect(response.headers()['x-frame-options']).toBeUndefined();

  // The firm's own demo page (our origin) does frame it.
  await page.goto('/demo/cedar-hollow');
  await expect(page.frameLocator('iframe[title="Price your walls"]').getByRole('heading', { name: 'Your rooms' })).toBeVisible({ timeout: 15_000 });

  // Staff pages may never be framed by anyone.
  const login = await page.request.get('/login');
  expect(login.headers()['content-security-policy']).toContain("frame-ancestors 'none'");
});

test('another origin cannot call the public API, and gets no CORS permission', async ({ request, baseURL }) => {
  const formToken = await formTokenFor(request, 'cedar-hollow');
  const foreign = await request.post('/api/embed/cedar-hollow/estimate', { headers: { Origin: FOREIGN }, data: { formToken, project: twoRoomProject } });
  expect(foreign.status()).toBe(403);
  expect(foreign.headers()['access-control-allow-origin']).toBeUndefined();
  const preflight = await request.fetch('/api/embed/cedar-hollow/leads', {
    method: 'OPTIONS',
    headers: { Origin: FOREIGN, 'Access-Control-Request-Method': 'POST' },
  });
  expect(preflight.status()).toBe(403);
  expect(preflight.headers()['access-control-allow-origin']).toBeUndefined();

  const own = await request.post('/api/embed/cedar-hollow/estimate', { headers: { Origin: baseURL! }, data: { formToken, project: twoRoomProject } });
  expect(own.status()).toBe(200);
  expect(own.headers()['access-control-allow-origin']).toBe(baseURL);
  const body = await own.json();
  expect(body.estimate.range.text).toMatch(/^\$[\d,]+ – \$[\d,]+$/);
  // The firm's rates stay on the server: no unit prices or labour rate in the answer.
  expect(JSON.stringify(body)).not.toMatch(/unitCents|rateCents|priceCents|materialMarkup/);
});

test('bad input gets a JSON 4xx with field messages, never a 500', async ({ request, baseURL }) => {
  const formToken = await formTokenFor(request, 'cedar-hollow');
  const cases: { data?: unknown; body?: string; headers?: Record<string, string>; status: number; field?: string }[] = [
    {
      data: { formToken, project: { ...twoRoomProject, rooms: [{ ...twoRoomProject.rooms[1], ceilingHeight: -5 }] } },
      status: 400,
      field: 'project.rooms.0.ceilingHeight',
    },
    {
      data: {
        formToken,
        project: { ...twoRoomProject, rooms: [{ ...twoRoomProject.rooms[1], walls: [{ length: 40, openings: [{ kind: 'door', width: 60 }] }] }] },
      },
      status: 400,
      field: 'project.rooms.0.walls.0.openings.0',
    },
    {
      data: { formToken, project: { ...twoRoomProject, rooms: [{ ...twoRoomProject.rooms[1], treatment: { id: 'marble', height: 'full' } }] } },
      status: 400,
      field: 'project.rooms.0.treatment',
    },
    { data: { formToken, project: twoRoomProject, isAdmin: true }, status: 400, field: 'isAdmin' },
    { data: { formToken: 'forged.token', project: twoRoomProject }, status: 400, field: 'formToken' },
    { body: 'not json', headers: { 'Content-Type': 'application/json' }, status: 400 },
    // A form-type body from our own page is refused as the wrong type (from elsewhere Astro refuses it earlier).
    { body: 'a=b', headers: { 'Content-Type': 'text/plain', Origin: baseURL! }, status: 415 },
  ];
  for (const c of cases) {
    const response = await request.post('/api/embed/cedar-hollow/estimate', { data: c.data ?? c.body, headers: c.headers });
    expect(response.status(), JSON.stringify(c.data ?? c.body).slice(0, 120)).toBe(c.status);
    const body = await response.json();
    expect(typeof body.error).toBe('string');
    if (c.field)
      expect(
        Object.keys(body.fields).some((key: string) => key.startsWith(c.field!)),
        JSON.stringify(body.fields),
      ).toBe(true);
  }
  const unknown = await request.post('/api/embed/no-such-firm/estimate', { data: {} });
  expect(unknown.status()).toBe(404);
});

test('200 rapid requests from one address are limited with Retry-After, whatever X-Forwarded-For says', async ({ request }) => {
  const formToken = await formTokenFor(request, 'northgate');
  const project = { ...twoRoomProject, rooms: twoRoomProject.rooms.map((room) => ({ ...room, treatment: { id: 'beadboard', height: 'wainscot' } })) };
  const statuses: number[] = [];
  let retryAfter: string | undefined;
  for (let batch = 0; batch < 10; batch++) {
    // A made-up X-Forwarded-For per request must not buy a fresh allowance.
    const answers = await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        request.post('/api/embed/northgate/estimate', { data: { formToken, project }, headers: { 'X-Forwarded-For': `203.0.113.${batch * 20 + i}` } }),
      ),
    );
    for (const answer of answers) {
      statuses.push(answer.status());
      if (answer.status() === 429) retryAfter ??= answer.headers()['retry-after'];
    }
  }
  expect(statuses.filter((s) => s === 200).length).toBeGreaterThan(0);
  expect(statuses.filter((s) => s === 429).length).toBeGreaterThan(100);
  expect(statuses.every((s) => s === 200 || s === 429)).toBe(true);
  expect(Number(retryAfter)).toBeGreaterThan(0);
});

test('the same idempotency key sent twice over HTTP makes one lead', async ({ request }) => {
  // A form opened a minute ago (people take longer than 4 s to fill it; sooner looks automated),
  // signed with the app's own secret, so no test waits for the clock.
  const [cedar] = await query<{ id: string }>(`select id from company where slug = 'cedar-hollow'`);
  const { token: formToken } = issueFormToken(cedar!.id, Date.now() - 60_000);
  const idempotencyKey = randomUUID();
  const data = {
    formToken,
    idempotencyKey,
    project: twoRoomProject,
    contact: {
      name: 'Lou Brandt',
      email: 'lou@example.test',
      phone: '512-555-0190',
      address: '9 Millrace Lane',
      postcode: '78745',
      preferredContact: 'phone',
      consent: true,
    },
  };
  await asANewVisitor();
  const [first, second] = await Promise.all([request.post('/api/embed/cedar-hollow/leads', { data }), request.post('/api/embed/cedar-hollow/leads', { data })]);
  expect(first.status()).toBe(201);
  expect(second.status()).toBe(201);
  expect((await first.json()).lead.reference).toBe((await second.json()).lead.reference);
  const rows = await query<{ count: string }>(`select count(*) from lead where idempotency_key = $1`, [idempotencyKey]);
  expect(Number(rows[0]!.count)).toBe(1);
});
