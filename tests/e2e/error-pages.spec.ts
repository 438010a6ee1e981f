import { expect, test } from '@playwright/test';

test('an address nothing answers gets our own page, not the framework’s', async ({ page }) => {
  const response = await page.goto('/no-such-page-here');
  expect(response!.status()).toBe(404);
  await expect(page.getByRole('heading', { name: 'There is no page here' })).toBeVisible();
  await expect(page.getByTestId('error-page')).toContainText('Lapwing');
  await expect(page.getByRole('link', { name: 'Go to the start page' })).toHaveAttribute('href', '/');
  // Astro's stock page says "404: Not found".
  await expect(page.getByText('404: Not found')).toHaveCount(0);
});

test('under a firm’s widget address the page wears the firm’s colour and gives its phone', async ({ page }) => {
  const response = await page.goto('/demo/cedar-hollow/old-offer');
  expect(response!.status()).toBe(404);
  await expect(page.getByTestId('error-page')).toContainText('Cedar Hollow Trim Co.');
  await expect(page.getByRole('link', { name: '+1 512 555 0147' })).toHaveAttribute('href', 'tel:+15125550147');
  // Cedar Hollow's demo colour #7A4E2D, with white text chosen by contrast.
  const button = page.getByRole('link', { name: 'Go to the start page' });
  await expect(button).toHaveCSS('background-color', 'rgb(122, 78, 45)');
  await expect(button).toHaveCSS('color', 'rgb(255, 255, 255)');
});

test('an estimate link with a wrong key gets our own page, which names no firm', async ({ page }) => {
  const response = await page.goto('/estimate/4f9a2c1e-7b3d-4e8f-9a6b-2c5d8e1f3a7b?key=not-the-key');
  expect(response!.status()).toBe(404);
  expect(response!.headers()['content-type']).toContain('text/html');
  await expect(page.getByRole('heading', { name: 'This estimate link does not open an estimate' })).toBeVisible();
  await expect(page.getByTestId('error-page')).not.toContainText('Cedar Hollow');
  await expect(page.getByText('This estimate link is not valid.')).toHaveCount(0);
});
