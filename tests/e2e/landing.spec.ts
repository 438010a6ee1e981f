import { expect, test } from '@playwright/test';

test('the landing page explains the product in DM Sans, and its board calculator island works', async ({ page }) => {
  const consoleErrors: string[] = [];
  page.on('console', (message) => {
    if (message.type() === 'error') consoleErrors.push(message.text());
  });
  await page.goto('/');
  await expect(page.getByRole('heading', { level: 1 })).toContainText('roughly what would this cost');

  // The font is shipped with the app (no font CDN) and actually used.
  await page.evaluate(() => document.fonts.ready);
  expect(await page.evaluate(() => document.fonts.check('16px "DM Sans"'))).toBe(true);
  const family = await page.locator('h1').evaluate((el) => getComputedStyle(el).fontFamily);
  expect(family).toContain('DM Sans');

  // The island hydrates and computes: 48 in of wall with 5-1/2 in boards and 1/8 in gaps.
  const island = page.getByRole('group', { name: 'Try a wall' });
  await island.scrollIntoViewIfNeeded();
  // Astro removes the `ssr` attribute once the island has hydrated; typing earlier would be lost.
  await expect(page.locator('astro-island')).not.toHaveAttribute('ssr');
  await island.getByLabel('Wall width').fill('48');
  await island.getByLabel('Board width').fill('5 1/2');
  await island.getByLabel('Gap between boards').fill('1/8');
  // Eight full boards and their eight gaps take 8 × 5.5 + 8 × 0.125 = 45 in; the ninth is ripped
  // to the remaining 3 in. Source: arithmetic, computed here.
  await expect(island.getByTestId('board-result')).toContainText('9 boards');
  await expect(island.getByTestId('board-result')).toContainText('3"');
  expect(consoleErrors).toEqual([]);
});
