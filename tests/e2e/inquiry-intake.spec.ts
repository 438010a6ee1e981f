import { expect, test, type Page } from '@playwright/test';
import { DEMO_PASSWORD, signedInAs } from './helpers/staff';

async function signIn(page: Page, email: string) {
  await page.goto('/login');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/app$/);
}

test('a salesperson takes an inquiry on the phone with the widget’s room form and sees it priced', async ({ page }) => {
  test.setTimeout(60_000);
  const email = `phone-${Date.now()}@homeowner.test`;
  await signIn(page, 'sam@cedar-hollow.test');
  await page.getByRole('link', { name: 'New phone inquiry' }).click();
  await expect(page.getByRole('heading', { name: 'New phone inquiry' })).toBeVisible();
  await expect(page.locator('astro-island[ssr]')).toHaveCount(0, { timeout: 15_000 });

  await page.getByLabel('Which room?').first().fill('Study');
  await page.getByRole('textbox', { name: 'Room length' }).fill("12'");
  await page.getByRole('textbox', { name: 'Room width' }).fill("10'");
  await page.getByRole('textbox', { name: 'Ceiling height' }).fill("8'");
  await page.getByText('Beadboard').first().click();
  await page.getByRole('textbox', { name: 'Height to the top of the cap rail' }).fill('36"');
  // The live range, as the widget would show it for the same rooms.
  await expect(page.getByTestId('live-range')).toContainText(/\$[\d,]+ – \$[\d,]+/, { timeout: 10_000 });
  const liveRange = (await page.getByTestId('live-range').locator('.figures').textContent())!.trim();

  // Saving before every question is answered is refused beside the question.
  await page.getByRole('textbox', { name: "Homeowner's name" }).fill('Vera Quill');
  await page.getByRole('textbox', { name: 'E-mail', exact: true }).fill(email);
  await page.getByRole('textbox', { name: 'Phone', exact: true }).fill('512 555 0166');
  await page.getByRole('textbox', { name: 'Street address' }).fill('12 Heron Way');
  await page.getByRole('textbox', { name: 'ZIP or postcode' }).fill('78704');
  await page.getByRole('button', { name: 'Save and price the inquiry' }).click();
  await expect(page.getByText('Confirm that the homeowner agreed')).toBeVisible();
  await page.getByLabel(/agreed on the phone/).check();
  await page.getByRole('button', { name: 'Save and price the inquiry' }).click();
  await expect(page.getByText('Choose yes, no or not sure')).toBeVisible();
  await page.getByText('Not sure', { exact: true }).click();
  await page.getByRole('button', { name: 'Save and price the inquiry' }).click();

  // The inquiry page opens with the estimate, marked as entered by staff, with its triage score.
  await expect(page).toHaveURL(/\/app\/leads\/[0-9a-f-]{36}$/, { timeout: 15_000 });
  await expect(page.getByRole('heading', { name: /Vera Quill/ })).toBeVisible();
  await expect(page.getByTestId('lead-range')).toHaveText(/^\$[\d,]+ – \$[\d,]+$/);
  // The live range priced the unanswered 1978 question as "not sure", the answer given: the same range.
  await expect(page.getByTestId('lead-range')).toHaveText(liveRange);
  await expect(page.getByTestId('inquiry-header').getByText('Entered by staff')).toBeVisible();
  await expect(page.getByTestId('triage-score')).toHaveText(/^\d{1,3}$/);
  await expect(page.getByTestId('triage-reason')).toHaveCount(6);
  // A salesperson may not delete.
  await expect(page.getByTestId('delete-lead')).toHaveCount(0);
});

test('an owner deletes an inquiry and restores it from Deleted inquiries', async ({ page }) => {
  test.setTimeout(60_000);
  const owner = await signedInAs('olive@cedar-hollow.test');
  const created = await owner.post('/api/app/leads', {
    data: {
      idempotencyKey: `intake-e2e-${Date.now()}`,
      project: {
        rooms: [{ name: 'Landing', ceilingHeight: 96, walls: [{ length: 144 }], treatment: { id: 'beadboard', height: 'wainscot' } }],
        builtBefore1978: 'no',
        measuredBy: 'homeowner-tape',
      },
      contact: {
        name: 'Rowan Delby',
        email: `delete-${Date.now()}@homeowner.test`,
        phone: '(512) 555-0144',
        address: '5 Finch Row',
        postcode: '78704',
        preferredContact: 'email',
        consent: true,
      },
    },
  });
  expect(created.status()).toBe(201);
  const { lead } = await created.json();
  await owner.dispose();

  await signIn(page, 'olive@cedar-hollow.test');
  await page.goto(lead.url);
  await expect(page.locator('astro-island[ssr]')).toHaveCount(0, { timeout: 15_000 });
  page.once('dialog', (dialog) => void dialog.accept());
  await page.getByTestId('delete-lead').click();
  await expect(page).toHaveURL(/\/app$/);
  // Gone from its address…
  expect((await page.request.get(lead.url)).status()).toBe(404);

  // …and listed among the deleted, with the day it goes for good.
  await page.goto('/app/leads/deleted');
  const row = page.getByTestId('deleted-lead').filter({ hasText: lead.reference });
  await expect(row).toContainText('Rowan Delby');
  await row.getByRole('button', { name: `Restore ${lead.reference}` }).click();
  await expect(page).toHaveURL(new RegExp(`${lead.url}$`));
  await expect(page.getByRole('heading', { name: /Rowan Delby/ })).toBeVisible();
  await page.goto('/app/leads/deleted');
  await expect(page.getByTestId('deleted-lead').filter({ hasText: lead.reference })).toHaveCount(0);
});
