import { createServer, type Server } from 'node:http';
import { expect, test, type Page } from '@playwright/test';
import { query } from '../helpers/app-database';
import { freeLoopbackPort } from '../helpers/ports';
import { DEMO_PASSWORD } from './helpers/staff';

// The owner's Setup in Chromium: an allowed site can frame the widget only once it is on the list,
// the brand colour's contrast is judged as it is typed, and the team page guards its only owner.

async function signIn(page: Page, email: string) {
  await page.goto('/login');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/app$/);
}

/** Another site, for real on another loopback port (a page.route page would count as public and be stopped earlier). */
async function otherSite(baseURL: string, slug: string): Promise<{ origin: string; close: () => Promise<void> }> {
  const port = await freeLoopbackPort();
  const server: Server = createServer((_request, response) => {
    response
      .writeHead(200, { 'content-type': 'text/html' })
      .end(`<!doctype html><h1>Builder’s site</h1><iframe id="w" src="${baseURL}/embed/${slug}"></iframe>`);
  });
  await new Promise<void>((resolve) => server.listen(port, '127.0.0.1', resolve));
  return {
    origin: `http://127.0.0.1:${port}`,
    close: async () => {
      server.closeAllConnections();
      await new Promise((resolve) => server.close(resolve));
    },
  };
}

test('the owner adds a site on the widget page, and from then on that site can frame the widget', async ({ page, baseURL }) => {
  // Northgate's list is put back afterwards; other specs frame Cedar Hollow's widget.
  const [{ embed_origins: kept }] = await query<{ embed_origins: string[] }>(`select embed_origins from company where slug = 'northgate'`);
  const site = await otherSite(baseURL!, 'northgate');
  try {
    // Before: Chromium refuses the frame and says why (waiting for that replaces a fixed wait).
    const refused = page.waitForEvent('console', (message) => message.text().includes('frame-ancestors'));
    await page.goto(site.origin);
    expect((await refused).text()).toContain('violates the following Content Security Policy directive');
    await expect(page.frameLocator('#w').getByRole('heading', { name: 'Your rooms' })).toHaveCount(0);

    await signIn(page, 'nora@northgate.test');
    await page.goto('/app/setup/widget');
    const form = page.locator('form[data-ready="true"]').first();
    await expect(form).toBeVisible();
    // A page address is refused beside its entry, naming it.
    const last = form.getByRole('textbox', { name: /^Allowed site/ }).last();
    const blank = (await last.inputValue()) === '';
    if (!blank) await form.getByRole('button', { name: 'Add a site' }).click();
    const entry = form.getByRole('textbox', { name: /^Allowed site/ }).last();
    await entry.fill(`${site.origin}/contact`);
    await form.getByRole('button', { name: 'Save allowed sites' }).click();
    await expect(form.getByText(`“${site.origin}/contact” must be the site only, with no path after the host.`)).toBeVisible();
    await entry.fill(site.origin);
    await form.getByRole('button', { name: 'Save allowed sites' }).click();
    await expect(form.getByRole('status')).toHaveText('Saved. These sites may show the widget from now on.');

    // The embed page's policy names the site at once, and its API answers that origin's CORS.
    const policy = (await page.request.get('/embed/northgate')).headers()['content-security-policy'];
    expect(policy).toContain(`frame-ancestors 'self'`);
    expect(policy).toContain(site.origin);

    // After: the same page of the other site shows the widget.
    await page.goto(site.origin);
    await expect(page.frameLocator('#w').getByRole('heading', { name: 'Your rooms' })).toBeVisible({ timeout: 15_000 });
  } finally {
    await site.close();
    await query(`update company set embed_origins = $1::jsonb where slug = 'northgate'`, [JSON.stringify(kept)]);
  }
});

test('the brand colour’s contrast is judged as it is typed, before anything is saved', async ({ page }) => {
  await signIn(page, 'nora@northgate.test');
  await page.goto('/app/setup/profile');
  const form = page.locator('form[data-ready="true"]');
  await expect(form).toBeVisible();
  const colour = form.getByLabel('Brand colour as #RRGGBB');
  const readout = form.getByTestId('brand-contrast');
  // Mid grey: white text reaches 4.48:1, dark ink 3.3:1. Source: WCAG 2.2 contrast ratio; SC 1.4.3 asks 4.5:1.
  await colour.fill('#777777');
  await expect(readout).toContainText('reaches only 4.4:1');
  await expect(readout).toContainText('it needs 4.5:1');
  // Northgate's own blue carries white text well above AA.
  await colour.fill('#1D4E89');
  await expect(readout).toContainText('White text reaches');
  await expect(readout).toContainText('meets WCAG 2.2 AA');
  // Saving the grey anyway is stopped by the shared schema in the form: the field is marked and nothing is stored.
  await colour.fill('#777777');
  await form.getByRole('button', { name: 'Save firm profile' }).click();
  await expect(colour).toHaveAttribute('aria-invalid', 'true');
  await expect(readout).toContainText('reaches only 4.4:1');
  const [{ brand_color }] = await query<{ brand_color: string }>(`select brand_color from company where slug = 'northgate'`);
  expect(brand_color).not.toBe('#777777');
});

test('the team page offers the only owner no role change or removal, and asks before removing someone, by name', async ({ page }) => {
  await signIn(page, 'olive@cedar-hollow.test');
  await page.goto('/app/setup/team');
  const olive = page.getByTestId('team-member').filter({ hasText: 'Olive Marten' });
  await expect(olive.getByTestId('only-owner')).toContainText('the only owner');
  await expect(olive.getByRole('combobox')).toHaveCount(0);
  await expect(olive.getByRole('link', { name: /^Remove/ })).toHaveCount(0);

  await page.getByRole('link', { name: 'Remove Sam Okafor' }).click();
  const question = page.getByRole('alertdialog');
  await expect(question).toContainText('Remove Sam Okafor (sam@cedar-hollow.test) from the team?');
  await question.getByRole('link', { name: 'Keep Sam Okafor' }).click();
  await expect(page.getByRole('alertdialog')).toHaveCount(0);
  await expect(page.getByTestId('team-member').filter({ hasText: 'Sam Okafor' })).toHaveCount(1);
});
