import { expect, test, type Page } from '@playwright/test';
import AxeBuilder from '@axe-core/playwright';
import { query } from '../helpers/app-database';
import { waitForMail } from '../helpers/mailbox';
import { noteWidgetOpened, waitUntilAPersonCouldSend } from './helpers/embed';
import { signedInAs } from './helpers/staff';

// The rooms people have: a small bathroom whose door, window and tub are each on their own wall,
// and a living room with one accent wall in another finish.

// Source: WCAG 2.2 success criteria at levels A and AA, as tagged by axe-core.
async function expectNoViolations(page: Page, what: string) {
  const results = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
  expect(
    results.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`),
    `axe violations: ${what}`,
  ).toEqual([]);
}

async function bathroom(page: Page, width: string) {
  await page.getByLabel('Which room?').first().fill('Bathroom');
  await page.getByRole('textbox', { name: 'Room length' }).first().fill("8'");
  await page.getByRole('textbox', { name: 'Room width' }).first().fill(width);
  await page.getByRole('textbox', { name: 'Ceiling height' }).first().fill("8'");
  await page.getByText("I'll say which wall").first().click();
}

for (const width of [320, 375])
  test(`at ${width} px, a 5 × 8 ft bathroom with the tub, door and window each on their own wall, and a living room with an accent wall, price, survive a reload and send`, async ({
    page,
  }) => {
    test.setTimeout(90_000);
    await page.setViewportSize({ width, height: 740 });
    await page.goto('/embed/cedar-hollow');
    await expect(page.locator('astro-island')).not.toHaveAttribute('ssr');
    noteWidgetOpened(page);
    await bathroom(page, "5'");
    // A room named bathroom is proposed as damp.
    await expect(page.getByRole('checkbox', { name: /This room gets damp/ })).toBeChecked();
    await page.getByLabel('Add a fixture on Long wall 1').selectOption('tub');
    await page.getByRole('button', { name: 'More doors on Short wall 1' }).click();
    await page.getByRole('button', { name: 'More windows on Long wall 2' }).click();
    await expect(page.getByRole('button', { name: 'Remove the bathtub on Long wall 1' })).toBeVisible();

    await page.getByRole('button', { name: 'Add another room' }).click();
    const living = page.getByRole('group', { name: 'Room 2' });
    await living.getByLabel('Which room?').fill('Living room');
    await expect(living.getByRole('checkbox', { name: /This room gets damp/ })).not.toBeChecked();
    await living.getByRole('textbox', { name: 'Room length' }).fill("14'");
    await living.getByRole('textbox', { name: 'Room width' }).fill("12'");
    await living.getByRole('textbox', { name: 'Ceiling height' }).fill("8'");
    await living.getByRole('button', { name: 'More doors in the Living room' }).click();
    await living.getByRole('button', { name: 'More windows in the Living room' }).click();
    // Counted, then placed where they fit, and the step says where.
    await expect(living.getByTestId('placed-note')).toContainText('Long wall 1: 1 door, 1 window');
    await expectNoViolations(page, 'rooms step, wall by wall, with a fixture');
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(width);
    await page.getByRole('button', { name: 'Next' }).click();

    await expect(page.getByRole('heading', { name: 'Treatment and height' })).toBeVisible();
    const bath = page.getByRole('region', { name: 'Bathroom' });
    await bath.getByText('Beadboard wainscot').click();
    await bath.getByRole('textbox', { name: 'Height to the top of the cap rail' }).fill('48"');
    const livingFinish = page.getByRole('region', { name: 'Living room' });
    await expect(livingFinish.getByRole('checkbox', { name: 'The same as the Bathroom' })).toBeChecked();
    await livingFinish.getByRole('checkbox', { name: /One accent wall/ }).check();
    await livingFinish.getByLabel('Which wall?').selectOption({ label: 'Short wall 1' });
    await livingFinish.getByLabel('Finish on the accent wall').selectOption({ label: 'Board and batten' });
    await livingFinish.getByText('Full height, floor to ceiling').click();
    await expect(page.getByTestId('live-range')).toContainText('$', { timeout: 10_000 });
    await expectNoViolations(page, 'finish per room, with an accent wall');

    // A reload mid-way keeps the step and every answer, the accent wall included.
    const rangeBefore = await page.getByTestId('live-range').textContent();
    await page.reload();
    await expect(page.getByRole('heading', { name: 'Treatment and height' })).toBeVisible({ timeout: 15_000 });
    await expect(page.getByRole('region', { name: 'Living room' }).getByLabel('Which wall?')).toHaveValue('1');
    await expect(page.getByTestId('live-range')).toHaveText(rangeBefore!, { timeout: 10_000 });
    await page.getByRole('button', { name: 'Back' }).click();
    await expect(page.getByRole('button', { name: 'Remove the bathtub on Long wall 1' })).toBeVisible();
    await page.getByRole('button', { name: 'Next' }).click();
    await page.getByRole('button', { name: 'Next' }).click();

    await page.getByText('Not sure', { exact: true }).click();
    await page.getByRole('button', { name: 'Next' }).click();
    await page.getByRole('button', { name: 'Next' }).click();
    await expect(page.getByTestId('result-range')).toHaveAttribute('aria-busy', 'false', { timeout: 10_000 });
    await page.getByRole('button', { name: /Send it to/ }).click();

    const email = `bathroom-${width}-${Date.now()}@example.test`;
    await page.getByRole('textbox', { name: 'Your name', exact: true }).fill('Rowan Pike');
    await page.getByRole('textbox', { name: 'E-mail', exact: true }).fill(email);
    await page.getByRole('textbox', { name: 'Phone', exact: true }).fill('(512) 555-0166');
    await page.getByRole('textbox', { name: 'Street address', exact: true }).fill('27 Heron Row');
    await page.getByRole('textbox', { name: 'ZIP or postcode', exact: true }).fill('78704');
    await page.getByLabel(/may contact me/).check();
    await waitUntilAPersonCouldSend(page);
    await page.getByRole('button', { name: /Send to/ }).click();
    await expect(page.getByRole('heading', { name: /Thank you/ })).toBeVisible({ timeout: 15_000 });

    // The homeowner's estimate page says what was chosen, room by room.
    const estimateUrl = await page.getByRole('link', { name: /See your estimate/ }).getAttribute('href');
    const estimatePage = await page.context().newPage();
    await estimatePage.goto(estimateUrl!);
    await expect(estimatePage.getByTestId('room-choices')).toContainText(
      "Living room: Beadboard wainscot, wainscot, 4' high on Long wall 1, Long wall 2, Short wall 2; accent wall Short wall 1: Board and batten, full height",
    );
    await expect(estimatePage.getByTestId('room-choices')).toContainText(
      "Bathroom: Beadboard wainscot, wainscot, 4' high on Long wall 1, Short wall 1, Long wall 2, Short wall 2 (damp room)",
    );

    // The lead keeps each room's own walls and finishes: the accent wall is a room of its own.
    // The homeowner's e-mail and the firm's lead page say the same, room by room.
    const accentLine = 'accent wall Short wall 1: Board and batten, full height';
    const confirmation = await waitForMail({ to: email, subject: 'Your price estimate', timeoutMs: 15_000 });
    expect(confirmation.text).toContain(accentLine);
    // From the firm's name, with the link to the estimate in the first screen of text.
    const [firm] = await query<{ name: string }>("select name from company where slug = 'cedar-hollow'");
    expect(confirmation.from.name).toBe(firm!.name);
    expect(confirmation.text.split('\n').slice(0, 6).join('\n')).toContain(new URL(estimateUrl!, 'http://x.test').pathname);
    const [stored] = await query<{ id: string }>('select id from lead where email = $1', [email]);
    const olive = await signedInAs('olive@cedar-hollow.test');
    const staffHtml = await (await olive.get(`/app/leads/${stored!.id}`)).text();
    expect(staffHtml).toContain('Short wall 1: Board and batten, full height');
    expect(staffHtml).toMatch(/Bathroom\s*\(damp room\)/);
    await olive.dispose();

    type StoredRooms = { data: { rooms: Array<{ name: string; treatment: { id: string; height: string }; walls: Array<{ label: string }> }> } };
    const [lead] = await query<{ inputs: StoredRooms }>('select inputs from lead where email = $1', [email]);
    expect(lead!.inputs.data.rooms.map((r) => [r.name, r.treatment.id, r.treatment.height, r.walls.map((w) => w.label).join(', ')])).toEqual([
      ['Bathroom', 'beadboard', 'wainscot', 'Long wall 1, Short wall 1, Long wall 2, Short wall 2'],
      ['Living room', 'beadboard', 'wainscot', 'Long wall 1, Long wall 2, Short wall 2'],
      ['Living room — accent wall', 'board-and-batten', 'full', 'Short wall 1'],
    ]);
  });

test('a door and a window that cannot fit a 4 ft wall are named beside that wall, in feet and inches, at once', async ({ page }) => {
  await page.setViewportSize({ width: 320, height: 740 });
  await page.goto('/embed/cedar-hollow');
  await expect(page.locator('astro-island')).not.toHaveAttribute('ssr');
  await bathroom(page, "4'");
  await page.getByRole('button', { name: 'More doors on Short wall 1' }).click();
  await page.getByRole('button', { name: 'More windows on Short wall 1' }).click();
  // Checked in the browser as the homeowner types: the issue asks for the message within 2 s.
  await expect(page.getByTestId('wall-0-1')).toContainText('The door and window add up to 6\' 0", more than this 4\' 0" wall.', { timeout: 2_000 });
  await expect(page.getByTestId('wall-0-0')).not.toContainText('more than this');
  await expectNoViolations(page, 'rooms step with a wall that cannot hold its door and window');

  // A removed room can be brought back, answers and all.
  await page.getByRole('button', { name: 'Add another room' }).click();
  await page.getByRole('group', { name: 'Room 2' }).getByLabel('Which room?').fill('Hallway');
  await page.getByRole('group', { name: 'Room 2' }).getByRole('textbox', { name: 'Room length' }).fill("12'");
  await page.getByRole('button', { name: 'Remove Hallway' }).click();
  await expect(page.getByRole('group', { name: 'Room 2' })).toHaveCount(0);
  await expect(page.getByRole('status').filter({ hasText: 'Hallway removed.' })).toBeVisible();
  await page.getByRole('button', { name: 'Undo' }).click();
  await expect(page.getByRole('group', { name: 'Room 2' }).getByRole('textbox', { name: 'Room length' })).toHaveValue("12'");
  await expect(page.getByRole('button', { name: 'Undo' })).toHaveCount(0);
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(320);
  // Moving the window to another wall clears it.
  await page.getByRole('button', { name: 'Fewer windows on Short wall 1' }).click();
  await page.getByRole('button', { name: 'More windows on Long wall 1' }).click();
  await expect(page.getByTestId('wall-0-1')).not.toContainText('more than this');
});
