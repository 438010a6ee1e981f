import { expect, test, type Locator, type Page } from '@playwright/test';

/** A picture of a card with room around it: the focus ring is drawn just outside the card's box. */
async function shotAround(page: Page, card: Locator): Promise<Buffer> {
  const box = (await card.boundingBox())!;
  return page.screenshot({
    clip: { x: Math.max(0, box.x - 8), y: Math.max(0, box.y - 8), width: box.width + 16, height: box.height + 16 },
    animations: 'disabled',
  });
}

/** Presses Tab until focus is inside `target`; fails after a handful of presses. */
async function tabInto(page: Page, target: Locator) {
  for (let i = 0; i < 15; i++) {
    await page.keyboard.press('Tab');
    if (await target.evaluate((el) => el.contains(document.activeElement))) return;
  }
  throw new Error('Tab never reached the card choices');
}

async function toTreatmentStep(page: Page) {
  await page.setViewportSize({ width: 375, height: 740 });
  await page.goto('/embed/cedar-hollow');
  await expect(page.locator('astro-island')).not.toHaveAttribute('ssr');
  await page.getByRole('textbox', { name: 'Room length' }).fill('14 ft');
  await page.getByRole('textbox', { name: 'Room width' }).fill('12 ft');
  await page.getByRole('textbox', { name: 'Ceiling height' }).fill('8 ft');
  await page.getByRole('button', { name: 'Next' }).click();
  await expect(page.getByRole('heading', { name: 'Treatment and height' })).toBeFocused();
}

// Source: WCAG 2.2 SC 2.4.7 Focus Visible (AA) and SC 2.4.11 Focus Not Obscured; a hidden radio's
// focus must show somewhere, here on its card.
test('by keyboard alone, every card choice shows a focus ring on its card, and it differs from the unfocused card', async ({ page }) => {
  await toTreatmentStep(page);
  const treatmentCards = page.getByRole('group', { name: 'What would you like on the walls?' }).locator('.choice-card');
  const first = treatmentCards.first();
  const unfocused = await shotAround(page, first);
  await expect(first).toHaveCSS('outline-style', 'none');

  await tabInto(page, first);
  await expect(first).toHaveCSS('outline-style', 'solid');
  const focused = await shotAround(page, first);
  expect(focused.equals(unfocused), 'the focused card looks different from the unfocused one').toBe(false);

  // Arrow keys move through the treatment cards; the ring follows the focus onto each card.
  const count = await treatmentCards.count();
  for (let i = 1; i < count; i++) {
    await page.keyboard.press('ArrowDown');
    await expect(treatmentCards.nth(i)).toHaveCSS('outline-style', 'solid');
    await expect(treatmentCards.nth(i - 1)).toHaveCSS('outline-style', 'none');
  }
  // The height cards, next in Tab order.
  const heightCards = page.getByRole('group', { name: 'How high?' }).locator('.choice-card');
  await tabInto(page, page.getByRole('group', { name: 'How high?' }));
  await expect(heightCards.first()).toHaveCSS('outline-style', 'solid');

  // A mouse click picks a card without drawing the keyboard ring.
  await treatmentCards.first().click();
  await expect(treatmentCards.first()).toHaveCSS('outline-style', 'none');
});

test('a length field says how it was read, asks inches or feet for a bare 12, and states limits in feet', async ({ page }) => {
  await page.setViewportSize({ width: 375, height: 740 });
  await page.goto('/embed/cedar-hollow');
  await expect(page.locator('astro-island')).not.toHaveAttribute('ssr');
  const length = page.getByRole('textbox', { name: 'Room length' });

  // Source: 1 ft = 12 in (NIST SP 811 Appendix B): 7 1/2 ft = 7' 6".
  await length.fill('7 1/2 ft');
  await expect(page.getByText(`= 7' 6"`)).toBeVisible();

  // Plausible room sizes: common practice, no source. 12 in is no room; 12 ft is.
  await length.fill('12');
  await expect(page.getByText('Inches or feet?')).toBeVisible();
  await page.getByRole('button', { name: '12 ft', exact: true }).click();
  await expect(length).toHaveValue('12 ft');
  await expect(page.getByText(`= 12' 0"`)).toBeVisible();
  await expect(page.getByText('Inches or feet?')).toHaveCount(0);

  // Next with a field left empty: focus lands on it, its message is tied to it, and a summary is announced.
  await page.getByRole('textbox', { name: 'Room width' }).fill('10 ft');
  await page.getByRole('textbox', { name: 'Ceiling height' }).fill('');
  await page.getByRole('button', { name: 'Next' }).click();
  await expect(page.getByRole('textbox', { name: 'Ceiling height' })).toBeFocused();
  await expect(page.getByRole('textbox', { name: 'Ceiling height' })).toHaveAttribute('aria-invalid', 'true');
  await expect(page.getByRole('textbox', { name: 'Ceiling height' })).toHaveAccessibleDescription(/Ceiling height is required/);
  await expect(page.getByRole('alert')).toContainText('need another look');
  await page.getByRole('textbox', { name: 'Ceiling height' }).fill('8 ft');
  await page.getByRole('textbox', { name: 'Room width' }).fill('10 ft');
  await page.getByRole('button', { name: 'Next' }).click();

  // Source: the core's limit for a wainscot is 96 in, which is 8 ft (1 ft = 12 in, NIST SP 811).
  await page.getByRole('group', { name: 'What would you like on the walls?' }).locator('.choice-card').first().click();
  await page.getByRole('textbox', { name: /Height to the top of the cap rail/ }).fill('10 ft');
  await expect(page.getByText('Wainscot height must be at most 8 ft.')).toBeVisible({ timeout: 5_000 });
  await expect(page.getByText(/at most 96 in/)).toHaveCount(0);
});

test('counters say their item, and the photo input has a name', async ({ page }) => {
  await page.goto('/embed/cedar-hollow');
  await expect(page.locator('astro-island')).not.toHaveAttribute('ssr');
  const windows = page.getByRole('group', { name: 'Windows in room 1', exact: true });
  const before = Number(await windows.locator('output [aria-hidden="true"]').textContent());
  await windows.getByRole('button', { name: 'More windows' }).click();
  const after = before + 1;
  await expect(windows.locator('output')).toHaveAttribute('aria-live', 'polite');
  await expect(windows.locator('output .sr-only')).toHaveText(`${after} ${after === 1 ? 'window' : 'windows'} in room 1`);
  await windows.getByRole('button', { name: 'More windows' }).click();
  await expect(windows.locator('output .sr-only')).toHaveText(`${after + 1} windows in room 1`);

  await page.getByRole('textbox', { name: 'Room length' }).fill('14 ft');
  await page.getByRole('textbox', { name: 'Room width' }).fill('12 ft');
  await page.getByRole('textbox', { name: 'Ceiling height' }).fill('8 ft');
  await page.getByRole('button', { name: 'Next' }).click();
  await page.getByRole('group', { name: 'What would you like on the walls?' }).locator('.choice-card').first().click();
  await page.getByRole('textbox', { name: /Height to the top of the cap rail/ }).fill('36"');
  await page.getByRole('button', { name: 'Next' }).click();
  await page.getByText('Not sure', { exact: true }).click();
  await page.getByRole('button', { name: 'Next' }).click();
  await expect(page.getByLabel('Photos of your walls')).toHaveAttribute('type', 'file');
});
