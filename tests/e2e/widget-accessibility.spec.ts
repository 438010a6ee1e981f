import { expect, test, type Page } from '@playwright/test';
import AxeBuilder from '@axe-core/playwright';
import { query } from '../helpers/app-database';

// Source: WCAG 2.2 success criteria at levels A and AA, as tagged by axe-core.
const WCAG_AA = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

async function expectNoViolations(page: Page, step: string) {
  const results = await new AxeBuilder({ page }).withTags(WCAG_AA).analyze();
  const summary = results.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
  expect(summary, `axe violations on the ${step} step`).toEqual([]);
}

/**
 * A firm with a light brand colour, for this test only: Cedar Hollow's published rates under a pale
 * yellow. Text on it must turn dark (the white it used to get is 1.5:1).
 */
async function lightBrandFirm(): Promise<string> {
  const slug = 'pale-birch-a11y';
  await query(
    `insert into company (id, slug, name, time_zone, brand_color, phone)
     values (gen_random_uuid(), $1, 'Pale Birch Carpentry', 'America/Chicago', '#F4D35E', '+1 512 555 0199') on conflict (slug) do nothing`,
    [slug],
  );
  await query(
    `insert into rate_book_version (id, company_id, number, status, data, note, published_at)
     select gen_random_uuid(), light.id, 1, 'published', cedar.data, cedar.note, now()
     from company light, rate_book_version cedar join company c on c.id = cedar.company_id
     where light.slug = $1 and c.slug = 'cedar-hollow' and cedar.status = 'published'
     on conflict (company_id, number) do nothing`,
    [slug],
  );
  return slug;
}

const brands = [
  // Cedar Hollow's demo colour #7A4E2D (dark) takes white text; #F4D35E (light) takes ink #1F2A2E.
  { name: 'dark', slug: async () => 'cedar-hollow', background: 'rgb(122, 78, 45)', text: 'rgb(255, 255, 255)' },
  { name: 'light', slug: lightBrandFirm, background: 'rgb(244, 211, 94)', text: 'rgb(31, 42, 46)' },
];

for (const brand of brands)
  test(`every step of the widget passes axe at WCAG 2.2 AA on a 320 px wide phone with a ${brand.name} brand colour, and works by keyboard`, async ({
    page,
  }) => {
    test.setTimeout(60_000);
    await page.setViewportSize({ width: 320, height: 740 });
    await page.goto(`/embed/${await brand.slug()}`);
    await expect(page.locator('astro-island')).not.toHaveAttribute('ssr');
    await expectNoViolations(page, 'rooms');
    // The "inches or feet?" question and a refused Next (focus on the field, message tied to it) pass too.
    await page.getByRole('textbox', { name: 'Room length' }).fill('12');
    await expect(page.getByRole('button', { name: '12 ft', exact: true })).toBeVisible();
    await expectNoViolations(page, 'rooms, asking inches or feet');
    await page.getByRole('button', { name: '12 ft', exact: true }).click();
    await page.getByRole('textbox', { name: 'Room width' }).fill('10 ft');
    await page.getByRole('textbox', { name: 'Ceiling height' }).fill('');
    await page.getByRole('button', { name: 'Next' }).click();
    await expect(page.getByRole('textbox', { name: 'Ceiling height' })).toBeFocused();
    await expectNoViolations(page, 'rooms, with a field to fix');
    await page.getByRole('textbox', { name: 'Room width' }).fill('10 ft');
    await page.getByRole('textbox', { name: 'Ceiling height' }).fill('8 ft');
    // Nothing is wider than the phone.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(320);

    // The primary action wears the firm's brand colour, with text chosen by contrast.
    await expect(page.getByRole('button', { name: 'Next' })).toHaveCSS('background-color', brand.background);
    await expect(page.getByRole('button', { name: 'Next' })).toHaveCSS('color', brand.text);
    // Rooms start empty: the sizes are typed.
    await page.getByRole('textbox', { name: 'Room length' }).fill("14'");
    await page.getByRole('textbox', { name: 'Room width' }).fill("12'");
    await page.getByRole('textbox', { name: 'Ceiling height' }).fill("8'");
    await page.getByRole('button', { name: 'Next' }).click();
    // Each step moves focus to its heading for screen reader users.
    await expect(page.getByRole('heading', { name: 'Treatment and height' })).toBeFocused();
    // Choosing a treatment by keyboard: tab into the radio group and pick with the arrow keys.
    await page.getByRole('radio').first().focus();
    await page.keyboard.press('ArrowDown');
    await expect(page.getByRole('radio').nth(1)).toBeChecked();
    await page.getByRole('textbox', { name: 'Height to the top of the cap rail' }).fill('36"');
    await expectNoViolations(page, 'treatment');

    await page.getByRole('button', { name: 'Next' }).click();
    await expectNoViolations(page, 'options');
    // Going on without answering "built before 1978" shows its message, which axe checks too.
    await page.getByRole('button', { name: 'Next' }).click();
    await expect(page.getByText('Choose yes, no or not sure')).toBeVisible();
    await expectNoViolations(page, 'options, with the unanswered question');
    await page.getByText('Not sure', { exact: true }).click();
    await page.getByRole('button', { name: 'Next' }).click();
    await expectNoViolations(page, 'photos');
    await page.getByRole('button', { name: 'Next' }).click();
    await expect(page.getByTestId('result-range')).toBeVisible({ timeout: 10_000 });
    await expectNoViolations(page, 'result');
    await page.getByRole('button', { name: /Send it to/ }).click();
    // The Send button used to stay white whatever the brand colour.
    await expect(page.getByRole('button', { name: /Send to/ })).toHaveCSS('color', brand.text);
    await page.getByRole('button', { name: /Send to/ }).click();
    await expect(page.getByText('Your name is required.')).toBeVisible();
    await expect(page.getByLabel('Your name')).toBeFocused();
    await expectNoViolations(page, 'contact, with errors showing');
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(320);
  });
