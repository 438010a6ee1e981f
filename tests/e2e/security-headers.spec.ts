import { spawn, type ChildProcess } from 'node:child_process';
import { createHash, randomBytes } from 'node:crypto';
import net from 'node:net';
import { expect, request, test, type APIResponse, type Page } from '@playwright/test';
import { BASE_URL, DEMO_PASSWORD, signedInAs } from './helpers/staff';
import { query } from '../helpers/app-database';

/**
 * The security headers of each kind of answer, as the production server sends them.
 * Sources: OWASP HTTP Headers Cheat Sheet (nosniff, frame-ancestors / X-Frame-Options DENY,
 * Referrer-Policy, HSTS); OWASP Content Security Policy Cheat Sheet (a script-src without
 * 'unsafe-inline', object-src 'none', base-uri); OWASP REST Security Cheat Sheet (APIs: no-store,
 * frame-ancestors 'none'); OWASP Session Management Cheat Sheet (no-store on pages with secrets).
 */
const NAMES = [
  'content-security-policy',
  'strict-transport-security',
  'x-content-type-options',
  'x-frame-options',
  'referrer-policy',
  'permissions-policy',
  'cache-control',
];

/** The policy as sorted directives, each build's script and style hashes shown as one placeholder. */
function directives(policy: string): string[] {
  return policy
    .split(';')
    .map((directive) => directive.trim().split(/\s+/))
    .filter((words) => words[0])
    .map(([name, ...values]) => {
      const hashed = values.some((value) => /^'sha(256|384|512)-[A-Za-z0-9+/=]+'$/.test(value));
      return [name, ...values.filter((value) => !value.startsWith("'sha")), ...(hashed ? ["'sha256-…'"] : [])].join(' ');
    })
    .sort();
}

function snapshot(response: APIResponse): Record<string, string | string[]> {
  const headers = response.headers();
  const picked: Record<string, string | string[]> = {};
  for (const name of NAMES) {
    if (headers[name] !== undefined) picked[name] = name === 'content-security-policy' ? directives(headers[name]) : headers[name];
  }
  return picked;
}

const PAGE_POLICY = [
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
  "object-src 'none'",
  "script-src 'self' 'sha256-…'",
  "style-src 'self' 'sha256-…'",
  "style-src-attr 'unsafe-inline'",
];
const PAGE = {
  'content-security-policy': PAGE_POLICY,
  'x-content-type-options': 'nosniff',
  'x-frame-options': 'DENY',
  'referrer-policy': 'strict-origin-when-cross-origin',
  'permissions-policy': 'camera=(), microphone=(), geolocation=()',
};
const NOT_A_PAGE_POLICY = ["base-uri 'none'", "default-src 'none'", "form-action 'none'", "frame-ancestors 'none'"];
const STATIC_POLICY = ["default-src 'none'", "frame-ancestors 'none'"];

/** A lead of the first demo firm with a view key this test knows (the database keeps only its digest). */
async function homeownerLink(): Promise<string> {
  const key = randomBytes(24).toString('base64url');
  const [lead] = await query<{ id: string }>(
    `update lead set view_token_hash = $1 where id = (select l.id from lead l join company c on c.id = l.company_id where c.slug = 'cedar-hollow' order by l.created_at limit 1) returning id`,
    [createHash('sha256').update(key).digest('hex')],
  );
  return `/estimate/${lead!.id}?key=${key}`;
}

async function anAssetOf(path: string): Promise<string> {
  const client = await request.newContext({ baseURL: BASE_URL });
  const html = await (await client.get(path)).text();
  await client.dispose();
  const asset = html.match(/\/_astro\/[\w.-]+\.js/)?.[0];
  expect(asset, `a built script on ${path}`).toBeTruthy();
  return asset!;
}

test('each kind of answer carries its security headers (http)', async () => {
  const anon = await request.newContext({ baseURL: BASE_URL });
  const owner = await signedInAs('olive@cedar-hollow.test');
  const [lead] = await query<{ id: string }>(`select l.id from lead l join company c on c.id = l.company_id where c.slug = 'cedar-hollow' limit 1`);
  const noStore = { 'cache-control': 'no-store' };

  const seen: Record<string, Record<string, string | string[]>> = {
    landing: snapshot(await anon.get('/')),
    login: snapshot(await anon.get('/login')),
    reset: snapshot(await anon.get('/reset')),
    resetLink: snapshot(await anon.get(`/reset/${randomBytes(20).toString('base64url')}`)),
    inviteLink: snapshot(await anon.get(`/invite/${randomBytes(20).toString('base64url')}`)),
    staffPage: snapshot(await owner.get('/app')),
    leadPage: snapshot(await owner.get(`/app/leads/${lead!.id}`)),
    staffApi: snapshot(await owner.get('/api/app/me')),
    signInRedirect: snapshot(await anon.get('/app', { maxRedirects: 0 })),
    homeowner: snapshot(await anon.get(await homeownerLink())),
    widgetPage: snapshot(await anon.get('/embed/cedar-hollow')),
    widgetApi: snapshot(await anon.post('/api/embed/cedar-hollow/estimate', { data: {} })),
    loader: snapshot(await anon.get('/widget.js')),
    icon: snapshot(await anon.get('/favicon.svg')),
    builtScript: snapshot(await anon.get(await anAssetOf('/'))),
    notFound: snapshot(await anon.get('/no-such-page')),
  };
  const widgetPolicy = seen.widgetPage['content-security-policy'] as string[];

  expect(seen).toEqual({
    landing: PAGE,
    login: { ...PAGE, ...noStore },
    reset: { ...PAGE, ...noStore },
    resetLink: { ...PAGE, ...noStore },
    inviteLink: { ...PAGE, ...noStore },
    staffPage: { ...PAGE, ...noStore },
    leadPage: { ...PAGE, ...noStore },
    staffApi: { ...PAGE, 'content-security-policy': NOT_A_PAGE_POLICY, ...noStore },
    signInRedirect: { ...PAGE, 'content-security-policy': NOT_A_PAGE_POLICY, ...noStore },
    // The homeowner's private link: nothing stored, no address leaked to other sites.
    homeowner: { ...PAGE, 'referrer-policy': 'no-referrer', ...noStore },
    // The widget's page may be framed by the firm's own sites, so it has no X-Frame-Options.
    widgetPage: {
      ...PAGE,
      'content-security-policy': PAGE_POLICY.map((directive) =>
        directive.startsWith('frame-ancestors') ? widgetPolicy.find((d) => d.startsWith('frame-ancestors'))! : directive,
      ),
      'x-frame-options': undefined,
      ...noStore,
    },
    widgetApi: { ...PAGE, 'content-security-policy': NOT_A_PAGE_POLICY, ...noStore },
    // Files are served before any middleware; the server wrapper gives them their headers.
    loader: { 'content-security-policy': STATIC_POLICY, 'x-content-type-options': 'nosniff', 'cache-control': 'public, max-age=0' },
    icon: { 'content-security-policy': STATIC_POLICY, 'x-content-type-options': 'nosniff', 'cache-control': 'public, max-age=0' },
    builtScript: { 'content-security-policy': STATIC_POLICY, 'x-content-type-options': 'nosniff', 'cache-control': 'public, max-age=31536000, immutable' },
    // Our own not-found page (src/pages/404.astro) is a page like any other.
    notFound: { ...PAGE, ...noStore },
  });
  // Served over http, no HSTS: browsers ignore it there, and it would pin a name that may never have https.
  expect(widgetPolicy.find((d) => d.startsWith('frame-ancestors'))).toMatch(/^frame-ancestors 'self'/);
  expect(Object.values(seen).some((headers) => 'strict-transport-security' in headers)).toBe(false);
  await Promise.all([anon.dispose(), owner.dispose()]);
});

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });
}

test.describe('served over https', () => {
  let server: ChildProcess | undefined;
  let origin = '';

  test.beforeAll(async () => {
    // A second instance of the same build whose public origin is https (TLS itself ends at a proxy).
    const port = await freePort();
    origin = `http://127.0.0.1:${port}`;
    server = spawn(process.execPath, ['scripts/serve.mjs'], {
      env: { ...process.env, PORT: String(port), PUBLIC_ORIGIN: 'https://lapwing.test' },
      stdio: ['ignore', 'pipe', 'inherit'],
    });
    await new Promise<void>((resolve, reject) => {
      server!.once('exit', (code) => reject(new Error(`the https-origin server stopped (code ${code})`)));
      server!.stdout!.on('data', (chunk: Buffer) => {
        if (chunk.toString().includes('listening')) resolve();
      });
    });
  });

  test.afterAll(async () => {
    if (!server || server.exitCode !== null) return;
    const exited = new Promise((resolve) => server!.once('exit', resolve));
    server.kill('SIGTERM');
    await exited;
  });

  test('pages, API answers and files all carry Strict-Transport-Security', async () => {
    const client = await request.newContext({ baseURL: origin });
    // Source: RFC 6797 §6.1 (max-age, includeSubDomains); OWASP HTTP Strict Transport Security Cheat Sheet (one year).
    const hsts = 'max-age=31536000; includeSubDomains';
    for (const path of ['/', '/login', '/embed/cedar-hollow', '/api/health', '/widget.js', '/favicon.svg', await anAssetOf('/')]) {
      const response = await client.get(path, { maxRedirects: 0 });
      expect(`${path}: ${response.headers()['strict-transport-security']}`).toBe(`${path}: ${hsts}`);
    }
    await client.dispose();
  });
});

/** Every policy refusal in the page or its frames, and every console message about one. */
async function watchPolicy(page: Page): Promise<string[]> {
  const refused: string[] = [];
  await page.exposeFunction('reportRefusal', (text: string) => refused.push(text));
  await page.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (event) => {
      (window as unknown as { reportRefusal: (text: string) => void }).reportRefusal(
        `${location.pathname}: ${event.violatedDirective} ${event.blockedURI} ${event.sample}`,
      );
    });
  });
  page.on('console', (message) => {
    if (/content security policy|content-security-policy/i.test(message.text())) refused.push(`console: ${message.text()}`);
  });
  page.on('pageerror', (error) => refused.push(`error: ${error.message}`));
  return refused;
}

test('with the policy on, every island hydrates and the browser refuses nothing', async ({ page }) => {
  test.setTimeout(60_000);
  const refused = await watchPolicy(page);
  const hydrated = async (where: Page | ReturnType<Page['frameLocator']>) => {
    await expect(where.locator('astro-island').first()).toBeAttached();
    // Astro removes `ssr` from an island once its script has run and React has taken over.
    await expect(where.locator('astro-island[ssr]')).toHaveCount(0, { timeout: 15_000 });
  };

  await page.goto('/');
  await page.locator('astro-island').first().scrollIntoViewIfNeeded();
  await hydrated(page);

  // The widget, framed by the firm's demo page, then used: the live range comes back.
  await page.goto('/demo/cedar-hollow');
  const widget = page.frameLocator('iframe[title="Price your walls"]');
  await hydrated(widget);
  await expect(widget.getByRole('heading', { name: 'Your rooms' })).toBeVisible();

  await page.goto(await homeownerLink());
  await expect(page.getByRole('heading', { name: /Your price estimate from/ })).toBeVisible();

  await page.goto('/reset');
  await page.goto('/login');
  await page.getByLabel('E-mail').fill('olive@cedar-hollow.test');
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/app$/);
  const [lead] = await query<{ id: string }>(`select l.id from lead l join company c on c.id = l.company_id where c.slug = 'cedar-hollow' limit 1`);
  for (const path of [`/app/leads/${lead!.id}`, '/app/visits', '/app/rates', '/app/setup/team', '/app/account']) {
    const response = await page.goto(path);
    expect(response?.status(), path).toBe(200);
  }
  // The Rate book editor's island checks every number with the core's schema in the browser.
  await page.goto('/app/rates/edit');
  // The editor is the largest island (every field, the core's schema): on a busy 2-core machine it hydrates in more than 5 s.
  await expect(page.locator('form[data-ready="true"]')).toBeVisible({ timeout: 20_000 });
  expect(refused).toEqual([]);
});
