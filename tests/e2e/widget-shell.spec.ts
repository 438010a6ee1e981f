import { expect, test, type FrameLocator, type Page } from '@playwright/test';
import { query } from '../helpers/app-database';
import { smallPng } from '../helpers/photo-files';
import { openWidgetOnDemoSite, waitUntilAPersonCouldSend } from './helpers/embed';

// The price widget's frame: no request spins without end, the live range says what it waits for,
// the range stays in view on a phone, the frame fits its content, and a reload loses nothing.
// Sources: docs/sources.md §60 (failed and stalled requests), §61 (the tab's storage), §62 (frame height).

const ESTIMATE = '**/api/embed/*/estimate';

function openOnDemoSite(page: Page, size = { width: 375, height: 740 }): Promise<FrameLocator> {
  return openWidgetOnDemoSite(page, size);
}

/** One 14 × 12 ft living room, typed in full (rooms may start empty). */
async function describeOneRoom(widget: FrameLocator) {
  await widget.getByLabel('Which room?').first().fill('Living room');
  await widget.getByRole('textbox', { name: 'Room length' }).fill("14'");
  await widget.getByRole('textbox', { name: 'Room width' }).fill("12'");
  await widget.getByRole('textbox', { name: 'Ceiling height' }).fill("8'");
}

async function chooseTreatment(widget: FrameLocator) {
  await widget.getByRole('button', { name: 'Next' }).click();
  await expect(widget.getByRole('heading', { name: 'Treatment and height' })).toBeVisible();
  await widget.getByText('Board and batten').first().click();
  // Fields start empty: the cap-rail height is typed like every other answer.
  await widget.getByRole('textbox', { name: /Height to the top of the cap rail/ }).fill('36"');
}

/** Where a widget element sits on the host page's screen (Playwright gives boxes in the top page's viewport). */
async function isOnScreen(page: Page, widget: FrameLocator, testId: string): Promise<boolean> {
  const box = await widget.getByTestId(testId).boundingBox();
  const viewport = page.viewportSize()!;
  return box !== null && box.y >= 0 && box.y + box.height <= viewport.height;
}

test('a stalled server gives a message and a Try again within 10 s, and trying again gets the range', async ({ page }) => {
  const widget = await openOnDemoSite(page);
  // The estimate endpoint takes the request and never answers.
  await page.route(ESTIMATE, () => undefined);
  await describeOneRoom(widget);
  await chooseTreatment(widget);
  const bar = widget.getByTestId('live-range');
  await expect(bar).toContainText('taking too long', { timeout: 10_000 });
  await page.unroute(ESTIMATE);
  await bar.getByRole('button', { name: 'Try again' }).click();
  await expect(bar).toContainText('$', { timeout: 10_000 });
});

test('a failing server (503) is asked once more, then the result step offers Try again', async ({ page }) => {
  const widget = await openOnDemoSite(page, { width: 1000, height: 900 });
  let asked = 0;
  await page.route(ESTIMATE, (route) => {
    asked++;
    return route.fulfill({ status: 503, contentType: 'application/json', body: JSON.stringify({ error: 'We are briefly unavailable. Please try again.' }) });
  });
  await describeOneRoom(widget);
  await chooseTreatment(widget);
  await expect(widget.getByTestId('live-range')).toContainText('briefly unavailable', { timeout: 10_000 });
  expect(asked).toBe(2);
  await widget.getByRole('button', { name: 'Next' }).click();
  await widget.getByText('Not sure', { exact: true }).click();
  await widget.getByRole('button', { name: 'Next' }).click();
  await widget.getByRole('button', { name: 'Next' }).click();
  await expect(widget.getByRole('heading', { name: 'Your price range', exact: true })).toBeVisible();
  const status = widget.getByTestId('result-status');
  await expect(status).toContainText('briefly unavailable', { timeout: 10_000 });
  await page.unroute(ESTIMATE);
  await status.getByRole('button', { name: 'Try again' }).click();
  await expect(widget.getByTestId('result-range')).toContainText('$', { timeout: 10_000 });
});

test('the live range says what it is waiting for, from the form and from the server', async ({ page }) => {
  const widget = await openOnDemoSite(page, { width: 1000, height: 900 });
  await describeOneRoom(widget);
  const bar = widget.getByTestId('live-range');
  await widget.getByRole('textbox', { name: 'Room length' }).fill('');
  await expect(bar).toContainText('Waiting for: the room length');
  await expect(bar).not.toContainText('appears here');
  await widget.getByRole('textbox', { name: 'Room length' }).fill("14'");

  // The server refuses the openings of the first wall (as it does for a door that cannot fit).
  await page.route(ESTIMATE, (route) =>
    route.fulfill({
      status: 400,
      contentType: 'application/json',
      body: JSON.stringify({ error: 'Check the walls.', fields: { 'project.rooms.0.walls.0.openings': 'The door does not fit on this wall.' } }),
    }),
  );
  await chooseTreatment(widget);
  await expect(bar).toContainText(/Waiting for: the (door|doors|door and window|doors and windows) on (Long|Short) wall \d/, { timeout: 5_000 });
  await expect(bar).not.toContainText('appears here');
  // Going on to the result, the range names the same answer and leads back to it.
  await widget.getByRole('button', { name: 'Next' }).click();
  await widget.getByText('Not sure', { exact: true }).click();
  await widget.getByRole('button', { name: 'Next' }).click();
  await widget.getByRole('button', { name: 'Next' }).click();
  await expect(widget.getByTestId('result-status')).toContainText(/waiting for the door/);
  await widget.getByRole('button', { name: 'Go to that answer' }).click();
  await expect(widget.getByRole('heading', { name: 'Your rooms' })).toBeVisible();
});

test('on a 375 × 740 phone the range is on screen at every step, and after Send the frame fits the thank-you', async ({ page }) => {
  test.setTimeout(60_000);
  const widget = await openOnDemoSite(page);
  const frame = page.locator('iframe[title="Price your walls"]');
  // The homeowner scrolls down to the widget.
  await frame.evaluate((element) => element.scrollIntoView({ block: 'start' }));
  expect(await isOnScreen(page, widget, 'live-range-top'), 'range on screen, rooms step').toBe(true);
  await describeOneRoom(widget);
  await widget.getByRole('button', { name: 'Next' }).click();
  await expect(widget.getByRole('heading', { name: 'Treatment and height' })).toBeFocused();
  expect(await isOnScreen(page, widget, 'live-range-top'), 'range on screen, treatment step').toBe(true);
  await widget.getByText('Board and batten').first().click();
  await widget.getByRole('textbox', { name: /Height to the top of the cap rail/ }).fill('36"');
  await expect(widget.getByTestId('live-range')).toContainText('$', { timeout: 10_000 });

  // Scrolled to the foot of a step, the range sits beside Next.
  await widget.getByRole('button', { name: 'Next' }).scrollIntoViewIfNeeded();
  expect(await isOnScreen(page, widget, 'live-range'), 'range beside Next').toBe(true);
  await widget.getByRole('button', { name: 'Next' }).click();
  await expect(widget.getByRole('heading', { name: 'A few details' })).toBeVisible();
  expect(await isOnScreen(page, widget, 'live-range-top'), 'range on screen, details step').toBe(true);
  await widget.getByText('Not sure', { exact: true }).click();
  await widget.getByRole('button', { name: 'Next' }).click();
  await expect(widget.getByRole('heading', { name: 'Photos', exact: true })).toBeVisible();
  expect(await isOnScreen(page, widget, 'live-range-top'), 'range on screen, photos step').toBe(true);
  await widget.getByRole('button', { name: 'Next' }).click();
  await expect(widget.getByRole('heading', { name: 'Your price range', exact: true })).toBeVisible();
  await expect(widget.getByTestId('result-range')).toContainText('$');
  expect(await isOnScreen(page, widget, 'result-range'), 'range on screen, result step').toBe(true);
  await widget.getByRole('button', { name: /Send it to/ }).click();
  await expect(widget.getByRole('heading', { name: 'Your details' })).toBeVisible();
  expect(await isOnScreen(page, widget, 'live-range-top'), 'range on screen, details form').toBe(true);

  await widget.getByRole('textbox', { name: 'Your name', exact: true }).fill('Rowan Teale');
  const tallest = (await frame.boundingBox())!.height;
  await widget.getByRole('textbox', { name: 'E-mail', exact: true }).fill(`rowan-${Date.now()}@example.test`);
  await widget.getByRole('textbox', { name: 'Phone', exact: true }).fill('(512) 555-0163');
  await widget.getByRole('textbox', { name: 'Street address', exact: true }).fill('27 Quarry Bend');
  await widget.getByRole('textbox', { name: 'ZIP or postcode', exact: true }).fill('78704');
  await widget.getByLabel(/may contact me/).check();
  await waitUntilAPersonCouldSend(page);
  await widget.getByRole('button', { name: /Send to/ }).click();
  await expect(widget.getByRole('heading', { name: /Thank you/ })).toBeVisible({ timeout: 15_000 });

  // The frame shrinks to the thank-you (no blank page under it), and its top is in view.
  const content = widget.getByTestId('thank-you');
  await expect
    .poll(async () => Math.abs((await frame.boundingBox())!.height - (await content.boundingBox())!.height), { timeout: 5_000 })
    .toBeLessThanOrEqual(50);
  expect((await frame.boundingBox())!.height).toBeLessThan(tallest);
  expect(await isOnScreen(page, widget, 'thank-you')).toBe(true);
});

test('a reload mid-way keeps the answers, the step and the photos, and the inquiry is sent with them', async ({ page }) => {
  test.setTimeout(90_000);
  const widget = await openOnDemoSite(page, { width: 375, height: 740 });
  await describeOneRoom(widget);
  await widget.getByLabel('Which room?').first().fill('Den');
  await chooseTreatment(widget);
  await widget.getByRole('button', { name: 'Next' }).click();
  await widget.getByText('Not sure', { exact: true }).click();
  await widget.getByRole('button', { name: 'Next' }).click();
  await expect(widget.getByRole('heading', { name: 'Photos', exact: true })).toBeVisible();
  await widget.locator('input[type=file]').setInputFiles([{ name: 'den-wall.png', mimeType: 'image/png', buffer: await smallPng() }]);
  const photoList = widget.getByRole('list', { name: 'Your photos' });
  await expect(photoList.getByText('Added.', { exact: true })).toHaveCount(1, { timeout: 30_000 });

  await page.reload();
  await expect(widget.getByRole('heading', { name: 'Photos', exact: true })).toBeVisible({ timeout: 15_000 });
  await expect(photoList.getByText('den-wall.png')).toBeVisible();
  await expect(photoList.getByText('Added.', { exact: true })).toHaveCount(1);
  // The earlier answers are back too.
  await widget.getByRole('button', { name: 'Back' }).click();
  await expect(widget.getByRole('radio', { name: 'Not sure' })).toBeChecked();
  await widget.getByRole('button', { name: 'Back' }).click();
  await widget.getByRole('button', { name: 'Back' }).click();
  await expect(widget.getByLabel('Which room?').first()).toHaveValue('Den');

  for (let i = 0; i < 4; i++) await widget.getByRole('button', { name: 'Next' }).click();
  await expect(widget.getByRole('heading', { name: 'Your price range', exact: true })).toBeVisible();
  await expect(widget.getByTestId('result-range')).toContainText('$', { timeout: 10_000 });
  await widget.getByRole('button', { name: /Send it to/ }).click();
  await widget.getByRole('textbox', { name: 'Your name', exact: true }).fill('Ines Marlow');
  await widget.getByRole('textbox', { name: 'E-mail', exact: true }).fill(`ines-${Date.now()}@example.test`);
  await widget.getByRole('textbox', { name: 'Phone', exact: true }).fill('(512) 555-0171');
  await widget.getByRole('textbox', { name: 'Street address', exact: true }).fill('9 Millrace Row');
  await widget.getByRole('textbox', { name: 'ZIP or postcode', exact: true }).fill('78704');
  await widget.getByLabel(/may contact me/).check();
  await waitUntilAPersonCouldSend(page);
  await widget.getByRole('button', { name: /Send to/ }).click();
  await expect(widget.getByRole('heading', { name: /Thank you/ })).toBeVisible({ timeout: 15_000 });
  const reference = (await widget.locator('strong.figures').textContent())!.trim();

  // The photo uploaded before the reload went with the inquiry.
  const [lead] = await query<{ photos: string }>(
    `select (select count(*) from lead_photo p where p.lead_id = l.id and p.status = 'ready') as photos from lead l where l.reference = $1`,
    [reference],
  );
  expect(Number(lead!.photos)).toBe(1);

  // After Send the draft is gone: a reload starts a fresh form.
  await page.reload();
  await expect(widget.getByRole('heading', { name: 'Your rooms' })).toBeVisible({ timeout: 15_000 });
  await expect(widget.getByLabel('Which room?').first()).not.toHaveValue('Den');
});

test('a refused Send names the earlier answer once and leads back to it', async ({ page }) => {
  const widget = await openOnDemoSite(page, { width: 1000, height: 900 });
  await describeOneRoom(widget);
  await chooseTreatment(widget);
  await expect(widget.getByTestId('live-range')).toContainText('$', { timeout: 10_000 });
  for (let i = 0; i < 2; i++) await widget.getByRole('button', { name: 'Next' }).click();
  await widget.getByText('Not sure', { exact: true }).click();
  await widget.getByRole('button', { name: 'Next' }).click();
  await widget.getByRole('button', { name: 'Next' }).click();
  await widget.getByRole('button', { name: /Send it to/ }).click();
  await page.route('**/api/embed/*/leads', (route) =>
    route.fulfill({
      status: 400,
      contentType: 'application/json',
      body: JSON.stringify({ error: 'Some of the answers need another look.', fields: { 'project.rooms.0.length': 'Room length must be at most 100 ft.' } }),
    }),
  );
  await widget.getByRole('textbox', { name: 'Your name', exact: true }).fill('Tam Oduya');
  await widget.getByRole('textbox', { name: 'E-mail', exact: true }).fill('tam@example.test');
  await widget.getByRole('textbox', { name: 'Phone', exact: true }).fill('(512) 555-0190');
  await widget.getByRole('textbox', { name: 'Street address', exact: true }).fill('3 Alder Yard');
  await widget.getByRole('textbox', { name: 'ZIP or postcode', exact: true }).fill('78704');
  await widget.getByLabel(/may contact me/).check();
  await widget.getByRole('button', { name: /Send to/ }).click();
  const alert = widget.getByRole('alert').filter({ hasText: 'earlier answers' });
  await expect(alert).toHaveText(/One of the earlier answers needs another look: the room length\.\s*Go to that answer/);
  await alert.getByRole('button', { name: 'Go to that answer' }).click();
  await expect(widget.getByRole('heading', { name: 'Your rooms' })).toBeVisible();
  await expect(widget.getByText('Room length must be at most 100 ft.')).toBeVisible();
});
