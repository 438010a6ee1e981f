import { expect, test } from '@playwright/test';
import { DEMO_PASSWORD } from './helpers/staff';

// Source: WCAG 2.2 SC 2.4.1 Bypass Blocks (A) and SC 4.1.3 Status Messages (AA).
test('a wrong password is announced, and the staff area starts with a skip link to its content', async ({ page }) => {
  await page.goto('/login');
  await page.getByLabel('E-mail').fill('olive@cedar-hollow.test');
  await page.getByLabel('Password').fill('not-the-password');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('alert')).toContainText('That e-mail address and password do not match.');

  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/app$/);
  const skip = page.getByRole('link', { name: 'Skip to content' });
  await expect(skip).not.toBeInViewport();
  await page.keyboard.press('Tab');
  await expect(skip).toBeFocused();
  await expect(skip).toBeInViewport();
  await page.keyboard.press('Enter');
  await expect(page).toHaveURL(/#content$/);
  await expect(page.locator('main#content')).toBeFocused();
});
