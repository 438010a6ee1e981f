import { expect, test, type APIRequestContext } from '@playwright/test';
import { query } from '../helpers/app-database';
import { formTokenFor, twoRoomProject } from './helpers/embed';
import { DEMO_PASSWORD, signedInAs } from './helpers/staff';
import { storyFirm, type StoryFirm } from './helpers/story-firm';

/**
 * The owner's Rate book from draft to published, on a firm of its own (a copy of Northgate), since
 * publishing changes every estimate the firm gives: raise the labour rate in a draft, see the sample
 * rooms and the replay of recent inquiries move, publish, and then the widget prices with the new
 * rate while the inquiry received before keeps the range it was given.
 */

let firm: StoryFirm;
let owner: APIRequestContext;

test.beforeAll(async () => {
  firm = await storyFirm({ slug: 'northgate', ownerEmail: 'nora@northgate.test' }, 'Story Wallworks');
  owner = await signedInAs(firm.ownerEmail);
});

test.afterAll(async () => {
  await owner?.dispose();
});

async function widgetRange(request: APIRequestContext): Promise<{ lowCents: number; highCents: number }> {
  const formToken = await formTokenFor(request, firm.slug);
  const answer = await request.post(`/api/embed/${firm.slug}/estimate`, { data: { formToken, project: twoRoomProject } });
  expect(answer.status()).toBe(200);
  return (await answer.json()).estimate.range;
}

test('the owner raises the labour rate in a draft, sees what it would do, publishes, and only new estimates change', async ({ page, request }) => {
  test.setTimeout(90_000);
  // An inquiry taken before the change, and the widget's price before it.
  const taken = await owner.post('/api/app/leads', {
    data: {
      idempotencyKey: `story-before-${firm.slug}`,
      project: twoRoomProject,
      contact: {
        name: 'Ada Before',
        email: 'ada-before@homeowner.test',
        phone: '(617) 555-0144',
        address: '12 Elm Street',
        postcode: '02139',
        preferredContact: 'phone',
        consent: true,
      },
    },
  });
  expect(taken.status()).toBe(201);
  const leadId = (await taken.json()).lead.id as string;
  const leadNow = async () =>
    (
      await query<{ low: number; high: number; version: string }>(
        `select range_low_cents as low, range_high_cents as high, rate_book_version_id as version from lead where id = $1`,
        [leadId],
      )
    )[0]!;
  const leadBefore = await leadNow();
  const widgetBefore = await widgetRange(request);

  await page.goto('/login');
  await page.getByLabel('E-mail').fill(firm.ownerEmail);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/app$/);

  // No draft yet: start one, a copy of version 1.
  await page.goto('/app/rates');
  await expect(page.getByText('Pricing estimates now')).toBeVisible();
  await page.getByRole('button', { name: 'Start a draft', exact: true }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Draft version 2 started as a copy of version 1' })).toBeVisible();

  // Labour from $85 to $120 an hour (Northgate's demo rate, then the raise).
  await page.getByRole('link', { name: 'Edit the draft' }).click();
  // The editor is the largest island (every field, the core's schema): on a busy 2-core machine it hydrates in more than 5 s.
  await expect(page.locator('form[data-ready="true"]')).toBeVisible({ timeout: 20_000 });
  await expect(page.getByLabel('Labour rate')).toHaveValue('85');
  await page.getByLabel('Labour rate').fill('120');
  await page.getByRole('button', { name: 'Save draft' }).click();
  await expect(page.getByRole('status')).toContainText('Draft saved');

  // Every sample room costs more under the draft, in the table and in the chart.
  await page.goto('/app/rates');
  const samples = page.getByRole('table', { name: 'Sample rooms, published and draft' });
  const boardAndBatten = samples.getByRole('row', { name: /Board and batten/ });
  await expect(boardAndBatten).toContainText(/\+\$[\d,]+ \(\+\d+\.\d %\)/);
  await expect(samples.getByRole('row', { name: /no change/ })).toHaveCount(0);
  await expect(page.locator('figure[aria-label^="Chart of the sample rooms"] .recharts-bar-rectangle').first()).toBeVisible();

  // The replay prices the inquiry taken before: it would go up.
  await page.getByRole('button', { name: 'Replay the last 90 days' }).click();
  await expect(page.getByLabel('Replay summary')).toContainText('Would go up');
  await expect(page.getByLabel('Replay summary').getByText('Would go up').locator('xpath=following-sibling::dd')).toHaveText('1');
  await expect(page.getByLabel('Replay summary').getByText('Would go down').locator('xpath=following-sibling::dd')).toHaveText('0');
  await expect(page.getByRole('table', { name: 'Largest changes' })).toContainText(/\+\$[\d,]+/);
  await expect(page.locator('figure[aria-label^="Chart of how many inquiries"] .recharts-bar-rectangle').first()).toBeVisible();

  // Publish, with a note for the version list.
  await page.getByRole('button', { name: 'Publish…' }).click();
  await page.getByLabel(/What changed/).fill('Labour to $120');
  await page.getByRole('button', { name: 'Publish version 2' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Version 2 is published' })).toBeVisible();
  const versions = page.getByRole('region', { name: 'Versions' });
  await expect(versions.getByRole('row', { name: /Version 2 — Labour to \$120/ })).toContainText('Pricing estimates');
  await expect(versions.getByRole('row', { name: /Version 1/ })).toContainText('Earlier');

  // The two versions differ in the labour rate, and in nothing else.
  await page.getByLabel('From').selectOption({ label: 'Version 1 — Starting rates' });
  await page.getByLabel('To').selectOption({ label: 'Version 2 — Labour to $120' });
  await page.getByRole('button', { name: 'Compare' }).click();
  const changes = page.getByRole('table', { name: 'Changes from version 1 to version 2' });
  await expect(changes.getByRole('row')).toHaveCount(2);
  await expect(changes.getByRole('row', { name: /Labour rate/ })).toContainText(/\$85\.00.*\$120\.00/);

  // From now on the widget prices with $120 an hour; the inquiry taken before keeps its range and version.
  const widgetAfter = await widgetRange(request);
  expect(widgetAfter.lowCents).toBeGreaterThan(widgetBefore.lowCents);
  expect(widgetAfter.highCents).toBeGreaterThan(widgetBefore.highCents);
  expect(await leadNow()).toEqual(leadBefore);
});
