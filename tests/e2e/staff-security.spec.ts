import { expect, request, test } from '@playwright/test';
import { BASE_URL, DEMO_PASSWORD, signedInAs } from './helpers/staff';

// Source: OWASP CSRF Prevention Cheat Sheet: state-changing requests must come from our own origin,
// whatever their content type (Astro's own check covers only form content types).
test('forged cross-site requests of every kind are refused and change nothing', async () => {
  const owner = await signedInAs('olive@cedar-hollow.test');
  const team = await (await owner.get('/api/app/team')).json();
  const sam = team.members.find((m: { email: string }) => m.email === 'sam@cedar-hollow.test');
  const evil = { Origin: 'https://evil.test' };
  const crossSite = { 'Sec-Fetch-Site': 'cross-site' };
  const forged = [
    owner.post('/api/app/team/invites', { headers: evil, data: { email: 'forged@evil.test', role: 'owner' } }),
    owner.post('/api/app/team/invites', { headers: crossSite, data: { email: 'forged@evil.test', role: 'owner' } }),
    owner.post('/api/app/team/invites', { headers: { Origin: '' }, data: { email: 'forged@evil.test', role: 'owner' } }),
    owner.post('/api/app/team/invites', {
      headers: { ...evil, 'Content-Type': 'text/plain' },
      data: JSON.stringify({ email: 'forged@evil.test', role: 'owner' }),
    }),
    owner.patch(`/api/app/team/members/${sam.id}`, { headers: evil, data: { role: 'owner' } }),
    owner.delete(`/api/app/team/members/${sam.id}`, { headers: evil }),
    owner.post('/app/setup/team', { headers: evil, form: { intent: 'invite', email: 'forged@evil.test', role: 'owner' } }),
    owner.post('/app/setup/team', { headers: evil, multipart: { intent: 'remove', id: sam.id } }),
    owner.post('/logout', { headers: crossSite }),
    owner.post('/login', { headers: evil, form: { email: 'olive@cedar-hollow.test', password: DEMO_PASSWORD } }),
  ];
  for (const response of await Promise.all(forged)) expect(response.status(), response.url()).toBe(403);
  const after = await (await owner.get('/api/app/team')).json();
  // The people are as they were (other test files change only invitations of this firm, in parallel).
  expect(after.members).toEqual(team.members);
  expect(after.members.find((m: { id: string }) => m.id === sam.id)).toEqual(sam);
  expect(JSON.stringify(after)).not.toContain('forged@evil.test');
  // Still signed in: the forged sign-out did nothing.
  expect((await owner.get('/api/app/me')).status()).toBe(200);
  await owner.dispose();
});

test('the session cookie is HttpOnly, SameSite=Lax and path-wide; each sign-in makes a new session; sign-out ends it on the server', async () => {
  const first = await signedInAs('rhea@cedar-hollow.test');
  const second = await request.newContext({ baseURL: BASE_URL, extraHTTPHeaders: { Origin: BASE_URL } });
  const response = await second.post('/login', { form: { email: 'rhea@cedar-hollow.test', password: DEMO_PASSWORD }, maxRedirects: 0 });
  const setCookie = response.headers()['set-cookie'];
  // Source: OWASP Session Management Cheat Sheet (cookie attributes); Secure is added when served over HTTPS.
  expect(setCookie).toMatch(/^lapwing_session=[a-z2-7]{40};/);
  expect(setCookie).toContain('HttpOnly');
  expect(setCookie).toContain('SameSite=Lax');
  expect(setCookie).toContain('Path=/');
  const tokenOf = async (context: typeof first) => (await context.storageState()).cookies.find((c) => c.name === 'lapwing_session')?.value;
  const firstToken = await tokenOf(first);
  expect(firstToken).toBeTruthy();
  expect(await tokenOf(second)).not.toBe(firstToken);

  const out = await first.post('/logout', { maxRedirects: 0 });
  expect(out.status()).toBe(303);
  // Replaying the old cookie after sign-out: the server no longer knows it.
  const replay = await request.newContext({ baseURL: BASE_URL, extraHTTPHeaders: { Cookie: `lapwing_session=${firstToken}` } });
  expect((await replay.get('/api/app/me')).status()).toBe(401);
  expect((await second.get('/api/app/me')).status()).toBe(200);
  await Promise.all([first.dispose(), second.dispose(), replay.dispose()]);
});

test('bad sign-in input gets a clear message and a 4xx, never a 500', async () => {
  const client = await request.newContext({ baseURL: BASE_URL, extraHTTPHeaders: { Origin: BASE_URL } });
  const empty = await client.post('/login', { form: { email: '', password: '' } });
  expect(empty.status()).toBe(400);
  const emptyPage = await empty.text();
  expect(emptyPage).toContain('Enter your e-mail address.');
  expect(emptyPage).toContain('Enter your password.');

  const malformed = await client.post('/login', { form: { email: 'olive at cedar', password: 'whatever it is' } });
  expect(malformed.status()).toBe(400);
  expect(await malformed.text()).toContain('Enter an e-mail address like name@example.com.');

  const huge = await client.post('/login', { form: { email: 'olive@cedar-hollow.test', password: 'x'.repeat(10 * 1024 * 1024) } });
  expect(huge.status()).toBe(413);
  expect(await huge.text()).toContain('The form is too large to read.');

  const long = await client.post('/login', { form: { email: 'olive@cedar-hollow.test', password: 'x'.repeat(129) } });
  expect(long.status()).toBe(400);
  expect(await long.text()).toContain('A Lapwing password has at most 128 characters.');

  const badJson = await (await signedInAs('olive@cedar-hollow.test')).post('/api/app/team/invites', { data: { email: 'nope', role: 'boss', extra: 1 } });
  expect(badJson.status()).toBe(400);
  const body = await badJson.json();
  expect(body.fields).toMatchObject({ email: 'Enter an e-mail address like name@example.com.', role: 'Choose Owner or Sales.' });

  for (const link of ['/invite/not-a-real-token', '/reset/not-a-real-token']) {
    const response = await client.get(link);
    expect(response.status()).toBe(404);
    expect(await response.text()).toMatch(/link is not valid/);
  }
  await client.dispose();
});
