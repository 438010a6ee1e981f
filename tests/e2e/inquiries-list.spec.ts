import { randomBytes } from 'node:crypto';
import { expect, test, type Page } from '@playwright/test';
import { DEMO_PASSWORD } from './helpers/staff';
import { query } from '../helpers/app-database';
import { searchTextOf } from '../../src/lib/server/leads/list-search';

// Inquiries this spec adds to the first demo firm (copies of one of its leads with a name and a
// phone of their own), removed afterwards so other specs meet the demo data as seeded.
const added: string[] = [];

async function addInquiry(name: string, phone: string): Promise<string> {
  const tag = randomBytes(3).toString('hex').toUpperCase();
  const contact = { name, phone, email: `${tag.toLowerCase()}@homeowner.test`, reference: `T${tag}`, address: '27 Quarry Lane', postcode: '78704' };
  const [row] = await query<{ id: string }>(
    `insert into "lead" ("id", "created_at", "updated_at", "company_id", "reference", "stage", "source", "name", "email", "phone", "address", "postcode",
       "preferred_contact", "consent_at", "inputs", "estimate", "rate_book_version_id", "range_low_cents", "range_high_cents", "idempotency_key",
       "view_token_hash", "response_due_at", "triage_score", "search_text", "finish_label", "finish_kinds", "covered_sq_ft", "photo_count")
     select gen_random_uuid(), now(), now(), l."company_id", $1, 'new', 'widget', $2, $3, $4, $5, $6, 'phone', now(), l."inputs", l."estimate",
       l."rate_book_version_id", l."range_low_cents", l."range_high_cents", $1, l."view_token_hash", now() + interval '4 hours', 50, $7,
       l."finish_label", l."finish_kinds", l."covered_sq_ft", 0
     from "lead" l join "company" c on c."id" = l."company_id" where c."slug" = 'cedar-hollow' limit 1
     returning "id"`,
    [contact.reference, contact.name, contact.email, contact.phone, contact.address, contact.postcode, searchTextOf(contact)],
  );
  added.push(row!.id);
  return row!.id;
}

test.afterAll(async () => {
  if (added.length) await query(`delete from "lead" where "id" = any($1::uuid[])`, [added]);
});

async function signIn(page: Page, email = 'sam@cedar-hollow.test') {
  await page.goto('/login');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/app$/);
}

async function hydrated(page: Page) {
  // Astro removes `ssr` from an island once React has taken it over; typing earlier would be lost.
  await expect(page.locator('astro-island[ssr]')).toHaveCount(0, { timeout: 15_000 });
}

test('search by a phone typed with spaces, a stage filter kept in the address, and the keyboard', async ({ page }) => {
  const id = await addInquiry('Perpetua Lindqvist', '+15125559876');
  await signIn(page);
  await hydrated(page);

  await page.getByLabel(/^Search/).fill('512 555 9876');
  const rows = page.getByTestId('inquiry-row');
  await expect(rows).toHaveCount(1);
  await expect(rows.first()).toContainText('Perpetua Lindqvist');
  await expect(page).toHaveURL(/[?&]q=512\+555\+9876/);

  await page.getByRole('button', { name: /^New inquiry/ }).click();
  await expect(page).toHaveURL(/stage=new/);
  await page.reload();
  await hydrated(page);
  await expect(page.getByLabel(/^Search/)).toHaveValue('512 555 9876');
  await expect(page.getByRole('button', { name: /^New inquiry/ })).toHaveAttribute('aria-pressed', 'true');
  await expect(rows).toHaveCount(1);

  // Back to the whole list: "/" focuses the search, j and k move, Enter opens (not while typing).
  await page.goto('/app?sort=name');
  await hydrated(page);
  await expect(page.locator('[data-keys-ready="true"]')).toHaveCount(1);
  await page.keyboard.press('/');
  await expect(page.getByLabel(/^Search/)).toBeFocused();
  await page.keyboard.press('j');
  await expect(page.getByLabel(/^Search/)).toHaveValue('j');
  await page.getByLabel(/^Search/).fill('');
  // The search follows typing after a pause: wait until the list is the whole list again.
  await expect(page).toHaveURL(/\/app\?sort=name$/);
  await expect(rows).toHaveCount(25);
  await page.keyboard.press('Escape');
  await expect(rows.nth(0)).toHaveAttribute('data-highlighted', 'true');
  await page.keyboard.press('j');
  await page.keyboard.press('j');
  await page.keyboard.press('k');
  await expect(rows.nth(1)).toHaveAttribute('data-highlighted', 'true');
  const second = await rows.nth(1).getByRole('link').first().getAttribute('href');
  await page.keyboard.press('Enter');
  await expect(page).toHaveURL(second!);
  // The inquiry page knows the list it came from: Previous and Next in that order.
  await expect(page.getByRole('link', { name: /^Previous:/ })).toBeVisible();
  await expect(page.getByRole('link', { name: /^Next:/ })).toBeVisible();
  expect(id).toBeTruthy();
});

test('on a phone the list is cards with a one-tap call', async ({ page }) => {
  await addInquiry('Ottoline Brackwater', '+15125559877');
  await page.setViewportSize({ width: 375, height: 740 });
  await signIn(page);
  await page.goto('/app?q=brackwater');
  await hydrated(page);
  await expect(page.getByRole('table', { name: 'Inquiries' })).toBeHidden();
  const card = page.getByTestId('inquiry-card');
  await expect(card).toHaveCount(1);
  await expect(card.getByRole('link', { name: 'Call Ottoline Brackwater' })).toHaveAttribute('href', 'tel:+15125559877');
  // The filters fold away behind one button, so the first cards are in view.
  await expect(card).toBeInViewport();
  await expect(page.getByRole('combobox', { name: /^Assigned to/ })).toBeHidden();
  await page.getByRole('button', { name: 'Filters' }).click();
  await expect(page.getByRole('combobox', { name: /^Assigned to/ })).toBeVisible();
});

test('a new inquiry appears without a reload, marked unread until opened', async ({ page }) => {
  test.setTimeout(60_000);
  await signIn(page);
  await page.goto('/app?q=quillfeather');
  await hydrated(page);
  await expect(page.getByText('No inquiries match this view.')).toBeVisible();

  await addInquiry('Imogen Quillfeather', '+15125559878');
  // The list asks again every 15 s, with no reload and no action of the person's.
  const row = page.getByTestId('inquiry-row');
  await expect(row).toHaveCount(1, { timeout: 25_000 });
  await expect(row.getByRole('link', { name: 'Unread: Imogen Quillfeather' })).toBeVisible();
  await expect(row.getByRole('link', { name: 'Unread: Imogen Quillfeather' })).toHaveClass(/font-bold/);

  await row.getByRole('link').first().click();
  await expect(page.getByRole('heading', { name: /Imogen Quillfeather/ })).toBeVisible();
  await page.goto('/app?q=quillfeather');
  await expect(page.getByRole('link', { name: 'Imogen Quillfeather', exact: true })).toBeVisible();
});
