import { expect, test, type Page } from '@playwright/test';
import AxeBuilder from '@axe-core/playwright';

// Source: WCAG 2.2 success criteria at levels A and AA, as tagged by axe-core.
const WCAG_AA = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

async function expectNoViolations(page: Page, step: string) {
  const results = await new AxeBuilder({ page }).withTags(WCAG_AA).analyze();
  const summary = results.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
  expect(summary, `axe violations on the ${step} step`).toEqual([]);
}

test('every step of the widget passes axe at WCAG 2.2 AA on a 320 px wide phone, and works by keyboard', async ({ page }) => {
  test.setTimeout(60_000);
  await page.setViewportSize({ width: 320, height: 740 });
  await page.goto('/embed/cedar-hollow');
  await expect(page.locator('astro-island')).not.toHaveAttribute('ssr');
  await expectNoViolations(page, 'rooms');
  // Nothing is wider than the phone.
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(320);

  // The primary action wears the firm's brand colour (Cedar Hollow's demo colour #7A4E2D).
  await expect(page.getByRole('button', { name: 'Next' })).toHaveCSS('background-color', 'rgb(122, 78, 45)');
  await page.getByRole('button', { name: 'Next' }).click();
  // Each step moves focus to its heading for screen reader users.
  await expect(page.getByRole('heading', { name: 'Treatment and height' })).toBeFocused();
  // Choosing a treatment by keyboard: tab into the radio group and pick with the arrow keys.
  await page.getByRole('radio').first().focus();
  await page.keyboard.press('ArrowDown');
  await expect(page.getByRole('radio').nth(1)).toBeChecked();
  await expectNoViolations(page, 'treatment');

  await page.getByRole('button', { name: 'Next' }).click();
  await expectNoViolations(page, 'options');
  // Going on without answering "built before 1978" shows its message, which axe checks too.
  await page.getByRole('button', { name: 'Next' }).click();
  await expect(page.getByText('Choose yes, no or not sure')).toBeVisible();
  await expectNoViolations(page, 'options, with the unanswered question');
  await page.getByText('Not sure').click();
  await page.getByRole('button', { name: 'Next' }).click();
  await expectNoViolations(page, 'photos');
  await page.getByRole('button', { name: 'Next' }).click();
  await expect(page.getByTestId('result-range')).toBeVisible({ timeout: 10_000 });
  await expectNoViolations(page, 'result');
  await page.getByRole('button', { name: /Send it to/ }).click();
  await page.getByRole('button', { name: /Send to/ }).click();
  await expect(page.getByText('Your name is required.')).toBeVisible();
  await expectNoViolations(page, 'contact, with errors showing');
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(320);
});
