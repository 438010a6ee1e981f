import http from 'node:http';
import { expect, test } from '@playwright/test';
import { BASE_URL, signedInAs } from './helpers/staff';
import { query } from '../helpers/app-database';

/**
 * Other spellings of the staff paths, sent exactly as written (an HTTP client would tidy `/./app`
 * away before sending it). The router serves several of them as the route they spell, so none may
 * get past the CSRF rule or the staff-area guard.
 */
type Answer = { status: number; location?: string; body: string };

function raw(path: string, { method = 'GET', headers = {}, body }: { method?: string; headers?: Record<string, string>; body?: string } = {}): Promise<Answer> {
  const { hostname, port } = new URL(BASE_URL);
  return new Promise((resolve, reject) => {
    const request = http.request(
      { hostname, port, path, method, headers: { ...headers, ...(body ? { 'Content-Length': Buffer.byteLength(body) } : {}) } },
      (response) => {
        let text = '';
        response.setEncoding('utf8');
        response.on('data', (chunk) => (text += chunk));
        response.on('end', () => resolve({ status: response.statusCode ?? 0, location: response.headers.location, body: text }));
      },
    );
    request.on('error', reject);
    request.end(body);
  });
}

async function cookieOf(email: string): Promise<string> {
  const client = await signedInAs(email);
  const cookies = (await client.storageState()).cookies.map((c) => `${c.name}=${c.value}`).join('; ');
  await client.dispose();
  return cookies;
}

let leadId: string;
test.beforeAll(async () => {
  const [lead] = await query<{ id: string }>(`select l.id from lead l join company c on c.id = l.company_id where c.slug = 'cedar-hollow' limit 1`);
  leadId = lead!.id;
});

test('signed out, every spelling of a staff page leads to sign-in or to nothing, never to the page or a 500', async () => {
  // Non-canonical spellings are sent to the canonical path first (308), where the guard applies.
  const redirected: [string, string][] = [
    ['//app', '/app'],
    ['///app', '/app'],
    ['/\\app', '/app'],
    ['/%61pp', '/app'],
    ['//app/leads/ID', '/app/leads/ID'],
    ['/app//leads/ID', '/app/leads/ID'],
    ['/%61pp/leads/ID?tab=notes', '/app/leads/ID?tab=notes'],
    ['//api/app/me', '/api/app/me'],
  ];
  for (const [variant, canonical] of redirected) {
    const answer = await raw(variant.replace('ID', leadId));
    expect(`${variant} ${answer.status} ${answer.location}`).toBe(`${variant} 308 ${canonical.replace('ID', leadId)}`);
  }
  // Spellings the URL parser already tidies (dot segments, %2e) and trailing slashes, which the
  // router serves as the route itself: the guard sees them as staff paths.
  for (const variant of ['/./app', '/app/../app', '/%2e/app', '/app/', '/app/./leads/ID', '/app/leads/ID/', '/app/visits/']) {
    const answer = await raw(variant.replace('ID', leadId));
    expect(`${variant} ${answer.status}`).toBe(`${variant} 302`);
    expect(answer.location).toMatch(/^\/login\?next=%2Fapp/);
  }
  for (const variant of ['/api/app/me/', '/api/./app/me', '/api/app/team/']) {
    expect(`${variant} ${(await raw(variant)).status}`).toBe(`${variant} 401`);
  }
  // The router matches paths case-sensitively: other cases are simply not pages.
  for (const variant of ['/APP', '/App/leads/ID', '/API/app/me']) {
    expect(`${variant} ${(await raw(variant.replace('ID', leadId))).status}`).toBe(`${variant} 404`);
  }
});

test('a forged write with any spelling of a staff path is refused and creates nothing', async () => {
  const cookie = await cookieOf('olive@cedar-hollow.test');
  const email = `spelling-${Date.now()}@forged.test`;
  const json = JSON.stringify({ email, role: 'owner' });
  const forged = { Cookie: cookie, Origin: 'https://evil.test', 'Content-Type': 'application/json' };
  const variants = [
    '//api/app/team/invites',
    '///api/app/team/invites',
    '/\\api/app/team/invites',
    '/%61pi/app/team/invites',
    '/api/%61pp/team/invites',
    '/./api/app/team/invites',
    '/api/./app/team/invites',
    '/api/x/../app/team/invites',
    '/api/app/team/invites/',
  ];
  for (const variant of variants) {
    const answer = await raw(variant, { method: 'POST', headers: forged, body: json });
    expect([403, 404], `${variant} → ${answer.status} ${answer.body}`).toContain(answer.status);
    expect(JSON.parse(answer.body)).toHaveProperty('error');
  }
  // A form post to a staff page, spelt oddly.
  for (const variant of ['//app/setup/team', '/%61pp/setup/team', '/./app/setup/team']) {
    const answer = await raw(variant, {
      method: 'POST',
      headers: { ...forged, 'Content-Type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ intent: 'invite', email, role: 'owner' }).toString(),
    });
    expect([403, 404], `${variant} → ${answer.status}`).toContain(answer.status);
  }
  expect(await query(`select id from team_invite where email = $1`, [email])).toEqual([]);

  // With our own Origin, a non-canonical spelling is still not a way in: it is refused as not found.
  const own = await raw('//api/app/team/invites', { method: 'POST', headers: { ...forged, Origin: BASE_URL }, body: json });
  expect(own.status).toBe(404);
  expect(await query(`select id from team_invite where email = $1`, [email])).toEqual([]);
});
