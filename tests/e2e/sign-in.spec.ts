import { expect, test } from '@playwright/test';
import { DEMO_PASSWORD } from './helpers/staff';

test('an owner signs in through the browser, lands where they were going, sees the owner’s screens and signs out', async ({ page }) => {
  const consoleErrors: string[] = [];
  page.on('console', (message) => {
    // The refused form itself answers 400 on purpose; Chromium logs that as a failed resource.
    if (message.type() === 'error' && !/status of 400/.test(message.text())) consoleErrors.push(message.text());
  });
  await page.goto('/app/rates');
  await expect(page).toHaveURL(/\/login\?next=%2Fapp%2Frates/);

  // Empty fields: each gets its message next to it.
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByLabel('E-mail')).toHaveAttribute('aria-invalid', 'true');
  await expect(page.locator('#email-error')).toHaveText('Enter your e-mail address.');
  await expect(page.locator('#password-error')).toHaveText('Enter your password.');

  await page.getByLabel('E-mail').fill('Olive@Cedar-Hollow.test');
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/app\/rates$/);
  await expect(page.getByRole('heading', { level: 1 })).toHaveText('Rate book');
  await expect(page.getByTestId('active-firm')).toHaveText('Cedar Hollow Trim Co.');
  const nav = page.getByRole('navigation', { name: 'Staff area' });
  await expect(nav.getByRole('link')).toHaveText(['Inquiries', 'Visits', 'Rate book', 'Reports', 'Setup']);

  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page).toHaveURL(/\/login\?notice=signed-out/);
  await page.goto('/app');
  await expect(page).toHaveURL(/\/login/);
  expect(consoleErrors).toEqual([]);
});

test('a salesperson sees Inquiries and Visits only; owner-only pages say so, and the owner’s own areas are not there for them', async ({ page }) => {
  await page.goto('/login');
  await page.getByLabel('E-mail').fill('sam@cedar-hollow.test');
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/app$/);
  await expect(page.getByRole('navigation', { name: 'Staff area' }).getByRole('link')).toHaveText(['Inquiries', 'Visits']);
  const refused = await page.goto('/app/leads/deleted');
  expect(refused?.status()).toBe(403);
  await expect(page.getByRole('heading', { level: 1 })).toHaveText('This page is for the firm’s owner');
  // Setup, the Rate book and Reports are the owner's business: for a salesperson there is no such page.
  for (const path of ['/app/setup/team', '/app/rates', '/app/reports']) {
    const hidden = await page.goto(path);
    expect(hidden?.status(), path).toBe(404);
    await expect(page.getByRole('heading', { level: 1 })).not.toHaveText('This page is for the firm’s owner');
  }
});
