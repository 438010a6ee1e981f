import AxeBuilder from '@axe-core/playwright';
import { expect, test, type APIRequestContext, type Browser, type Page } from '@playwright/test';
import { DEMO_PASSWORD, signedInAs } from './helpers/staff';

/**
 * The owner edits the Rate book draft: bad numbers get messages on their fields in the units typed,
 * good ones are saved, and a second owner's save over an older revision is refused with a notice
 * naming what changed. Northgate's draft is used and put back afterwards, so other specs meet the
 * demo data as seeded.
 */

const OWNER = 'nora@northgate.test';

type Draft = { revision: number; data: { materialMarkup: number; labour: { rateCents: number }; catalogue: { sheets: { priceCents: number }[] } } };

let api: APIRequestContext;
let draftBefore: Draft['data'] | null = null;

async function currentDraft(): Promise<Draft> {
  const answer = await api.get('/api/app/rates');
  expect(answer.status()).toBe(200);
  let { draft } = (await answer.json()) as { draft: Draft | null };
  if (!draft) {
    const started = await api.post('/api/app/rates/draft', { data: {} });
    expect([200, 201]).toContain(started.status());
    draft = (await started.json()) as Draft;
  }
  return draft;
}

test.beforeAll(async () => {
  api = await signedInAs(OWNER);
  draftBefore = (await currentDraft()).data;
});

test.afterAll(async () => {
  if (draftBefore) {
    const { revision } = await currentDraft();
    const put = await api.put('/api/app/rates/draft', { data: { revision, data: draftBefore } });
    expect(put.status()).toBe(200);
  }
  await api.dispose();
});

async function signIn(page: Page) {
  await page.goto('/login');
  await page.getByLabel('E-mail').fill(OWNER);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/app$/);
}

/** Opens the editor and waits until its island has hydrated (it marks the form once its effects run). */
async function openEditor(page: Page) {
  await page.goto('/app/rates/edit');
  // The editor is the largest island (every field, the core's schema): on a busy 2-core machine it hydrates in more than 5 s.
  await expect(page.locator('form[data-ready="true"]')).toBeVisible({ timeout: 20_000 });
}

async function ownerPage(browser: Browser): Promise<Page> {
  const context = await browser.newContext();
  const page = await context.newPage();
  await signIn(page);
  await openEditor(page);
  return page;
}

const firstSheet = (page: Page) => page.getByRole('group', { name: /^Sheet 1\b/ });

test('the owner gets field messages for a negative price and a 10,000 % markup, saves good numbers, and a save over an older revision names what changed', async ({
  browser,
}) => {
  test.setTimeout(60_000);
  const page = await ownerPage(browser);

  // Bad numbers: each message sits on its field and is its description.
  const price = firstSheet(page).getByLabel('Sheet price');
  const markup = page.getByLabel('Material markup');
  await price.fill('-12');
  await markup.fill('10000');
  await page.getByRole('button', { name: 'Save draft' }).click();
  await expect(firstSheet(page).getByText('Sheet price cannot be negative.')).toBeVisible();
  await expect(price).toHaveAttribute('aria-invalid', 'true');
  await expect(price).toHaveAccessibleDescription(/Sheet price cannot be negative\./);
  await expect(markup).toHaveAccessibleDescription(/Material markup must be at most 300 %\./);
  await expect(page.getByRole('list', { name: 'Fields that need a look' })).toContainText('Sheet 1 · Sheet price');
  // Source: WCAG 2.2 level A and AA success criteria, as axe-core checks them.
  const axe = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
  expect(axe.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`)).toEqual([]);

  // Fixed, and saved: stored as cents and a fraction.
  await price.fill('35.50');
  await markup.fill('30');
  await page.getByRole('button', { name: 'Save draft' }).click();
  await expect(page.getByRole('status')).toContainText('Draft saved');
  await expect(price).not.toHaveAttribute('aria-invalid', 'true');
  const saved = await currentDraft();
  expect(saved.data.catalogue.sheets[0]!.priceCents).toBe(3550);
  expect(saved.data.materialMarkup).toBe(0.3);

  // A second owner opens the same revision; the first saves a new labour rate before the second saves.
  const other = await ownerPage(browser);
  await page.getByLabel('Labour rate').fill('91');
  await page.getByRole('button', { name: 'Save draft' }).click();
  await expect(page.getByRole('status')).toContainText('Draft saved');

  await other.getByLabel('Material markup').fill('40');
  await other.getByRole('button', { name: 'Save draft' }).click();
  const notice = other.getByRole('alert');
  await expect(notice).toContainText('Someone else saved this draft at');
  await expect(notice).toContainText(/changed:.*Labour rate/);
  // Nothing was overwritten: the stored draft still has the first owner's rate and markup.
  const stored = await currentDraft();
  expect(stored.data.labour.rateCents).toBe(9100);
  expect(stored.data.materialMarkup).toBe(0.3);

  // The second owner takes their version: the form shows the first owner's numbers.
  await notice.getByRole('button', { name: 'Load their version' }).click();
  await expect(other.getByLabel('Labour rate')).toHaveValue('91');
  await expect(other.getByLabel('Material markup')).toHaveValue('30');
  await other.context().close();
  await page.context().close();
});
