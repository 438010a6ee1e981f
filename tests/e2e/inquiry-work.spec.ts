import { expect, test } from '@playwright/test';
import { query } from '../helpers/app-database';
import { waitForMail } from '../helpers/mailbox';
import { sidewaysPhoneJpeg } from '../helpers/photo-files';
import { openWidgetOnDemoSite, waitUntilAPersonCouldSend } from './helpers/embed';
import { DEMO_PASSWORD } from './helpers/staff';

/**
 * A salesperson works an inquiry that just came in through the widget: opens it from Inquiries,
 * looks at the photo full size, logs a call, asks a teammate to help with an @mention (who gets an
 * e-mail), and e-mails the homeowner from a template (which arrives with a link that opens the
 * estimate), moves it to Spoken to, and finds it again by the phone typed with spaces. Every
 * step lands on the inquiry's timeline, in order.
 */
test('a salesperson works a new inquiry: photo, call, note with a mention, e-mail from a template, Spoken to, found by phone', async ({ page, browser }) => {
  test.setTimeout(120_000);
  const suffix = Date.now().toString(36);
  const name = `Ines Pellworth ${suffix}`;
  const email = `ines-${suffix}@example.test`;

  // The homeowner prices one room with a photo on the firm's website and sends it.
  const widget = await openWidgetOnDemoSite(page);
  await widget.getByLabel('Which room?').first().fill('Study');
  await widget.getByRole('textbox', { name: 'Room length' }).fill("12'");
  await widget.getByRole('textbox', { name: 'Room width' }).fill("10'");
  await widget.getByRole('textbox', { name: 'Ceiling height' }).first().fill("8'");
  await widget.getByRole('button', { name: 'Next' }).click();
  await widget.getByText('Board and batten').first().click();
  await widget.getByRole('textbox', { name: 'Height to the top of the cap rail' }).first().fill('36"');
  await expect(widget.getByTestId('live-range')).toContainText('$', { timeout: 10_000 });
  await widget.getByRole('button', { name: 'Next' }).click();
  await widget.getByText('Not sure', { exact: true }).click();
  await widget.getByRole('button', { name: 'Next' }).click();
  await widget.locator('input[type=file]').setInputFiles([{ name: 'study.jpg', mimeType: 'image/jpeg', buffer: await sidewaysPhoneJpeg() }]);
  await expect(widget.getByRole('list', { name: 'Your photos' }).getByText('Added.', { exact: true })).toHaveCount(1, { timeout: 30_000 });
  await widget.getByRole('button', { name: 'Next' }).click();
  await widget.getByRole('button', { name: /Send it to/ }).click();
  await widget.getByRole('textbox', { name: 'Your name', exact: true }).fill(name);
  await widget.getByRole('textbox', { name: 'E-mail', exact: true }).fill(email);
  await widget.getByRole('textbox', { name: 'Phone', exact: true }).fill('(512) 555-0163');
  await widget.getByRole('textbox', { name: 'Street address', exact: true }).fill('27 Quarry Bend');
  await widget.getByRole('textbox', { name: 'ZIP or postcode', exact: true }).fill('78704');
  await widget.getByLabel(/may contact me/).check();
  await waitUntilAPersonCouldSend(page);
  await widget.getByRole('button', { name: /Send to/ }).click();
  await expect(widget.getByRole('heading', { name: /Thank you/ })).toBeVisible({ timeout: 15_000 });
  const reference = (await widget.locator('strong.figures').textContent())!.trim();

  // A salesperson signs in and opens it from Inquiries.
  const staff = await browser.newPage();
  await staff.goto('/login');
  await staff.getByLabel('E-mail').fill('sam@cedar-hollow.test');
  await staff.getByLabel('Password').fill(DEMO_PASSWORD);
  await staff.getByRole('button', { name: 'Sign in' }).click();
  await expect(staff).toHaveURL(/\/app$/);
  await expect(staff.locator('astro-island[ssr]')).toHaveCount(0, { timeout: 15_000 });
  // At the top of New inquiry, newest first, marked unread until someone opens it.
  await staff.getByRole('button', { name: /^New inquiry/ }).click();
  await expect(staff).toHaveURL(/stage=new/);
  // (The other browser worker may send one inquiry meanwhile, so ours is first or second.)
  const rows = staff.getByTestId('inquiry-row');
  const top = rows.filter({ hasText: name });
  await expect(top).toContainText('Unread');
  const names = await rows.evaluateAll((found) => found.slice(0, 2).map((row) => row.textContent ?? ''));
  expect(names.some((text) => text.includes(name))).toBe(true);
  await top.getByRole('link', { name }).first().click();
  await expect(staff.getByRole('heading', { level: 1 })).toContainText(name);
  await expect(staff.locator('astro-island[ssr]')).toHaveCount(0, { timeout: 15_000 });

  // The photo full size: a dialog, Escape closes it, focus goes back to the thumbnail. Its first
  // link is refused as storage refuses an expired one; the gallery asks for a fresh link and shows it.
  let refused = 0;
  await staff.route(/\/photos\/[0-9a-f-]{36}\/[0-9a-f-]{36}\.jpg\?/, async (route) => {
    if (refused++ === 0) await route.fulfill({ status: 403, contentType: 'application/xml', body: '<Error><Code>AccessDenied</Code></Error>' });
    else await route.continue();
  });
  const resigned = staff.waitForRequest((request) => /\/api\/app\/leads\/[0-9a-f-]{36}\/photos$/.test(request.url()));
  const thumbnail = staff.getByRole('button', { name: /Open photo 1 of 1 full size/ });
  await thumbnail.click();
  await resigned;
  const viewer = staff.getByRole('dialog', { name: /Photo 1 of 1/ });
  await expect(viewer).toBeVisible();
  const full = viewer.getByRole('img', { name: /full size/ });
  await expect.poll(() => full.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).toBeGreaterThan(0);
  expect(refused).toBe(2);
  await staff.keyboard.press('Escape');
  await expect(viewer).toBeHidden();
  await expect(thumbnail).toBeFocused();

  // A call that reached the homeowner.
  const callForm = staff.getByRole('form', { name: 'Log a call' });
  await callForm.getByRole('radio', { name: 'Spoke with them' }).check();
  await callForm.getByLabel('What was said (optional)').fill('Wants the study done before the holidays.');
  await callForm.getByRole('button', { name: 'Log call' }).click();
  await expect(callForm.getByRole('status')).toHaveText('Call logged: spoke with them.');

  // A note that mentions a teammate, picked from the list with the keyboard.
  const noteForm = staff.getByRole('form', { name: 'Add a note' });
  const note = noteForm.getByRole('combobox', { name: 'Note' });
  await note.click();
  await note.pressSequentially('Can you measure this one, @rh');
  await expect(noteForm.getByRole('option', { name: 'Rhea Lindqvist' })).toBeVisible();
  await note.press('Enter');
  await expect(note).toHaveValue('Can you measure this one, @Rhea Lindqvist ');
  await note.pressSequentially('? Thursday works for them.');
  await noteForm.getByRole('button', { name: 'Add note' }).click();
  await expect(noteForm.getByRole('status')).toHaveText('Note added. Rhea Lindqvist will get an e-mail.');
  // Rhea also gets the new-inquiry alert; the mention is its own e-mail.
  const mention = await waitForMail({ to: 'rhea@cedar-hollow.test', subject: `mentioned you on inquiry ${reference}`, timeoutMs: 15_000 });
  expect(mention.subject).toBe(`Sam Okafor mentioned you on inquiry ${reference}`);
  expect(mention.text).toContain('Thursday works for them.');

  // An e-mail from a template, filled in, sent through the mail queue.
  const mailForm = staff.getByRole('form', { name: 'E-mail the homeowner' });
  await mailForm.getByLabel('Start from a template').selectOption({ label: 'First reply' });
  await expect(mailForm.getByLabel('Subject')).toHaveValue(`Your wall estimate from Cedar Hollow Trim Co. (${reference})`);
  await expect(mailForm.getByLabel('Message')).toHaveValue(new RegExp(`^Hello ${name},`));
  await expect(mailForm.getByLabel('Message')).toHaveValue(/\{estimate_link\}/);
  await mailForm.getByRole('button', { name: 'Send e-mail' }).click();
  await expect(mailForm.getByRole('status')).toContainText(`E-mail to ${email} is on its way.`);
  const sent = await waitForMail({ to: email, subject: 'Your wall estimate', timeoutMs: 15_000 });
  expect(sent.from.name).toBe('Cedar Hollow Trim Co.');
  expect(sent.replyTo).toBe('hello@cedar-hollow.test');
  const link = sent.text.match(/https?:\/\/\S+\/estimate\/[0-9a-f-]{36}\?key=\S+/)?.[0];
  expect(link).toBeDefined();

  // The link opens the homeowner's estimate.
  await page.goto(link!);
  await expect(page.getByRole('heading', { name: 'Your price estimate from Cedar Hollow Trim Co.' })).toBeVisible();
  await expect(page.getByTestId('result-range')).toHaveText(/^\$[\d,]+ – \$[\d,]+$/);

  // Spoken to: the stage moves, and the history on the page shows every step in order.
  await staff.reload();
  await expect(staff.locator('astro-island[ssr]')).toHaveCount(0, { timeout: 15_000 });
  await staff.getByLabel('Stage', { exact: true }).selectOption({ label: 'Spoken to' });
  const history = staff.getByTestId('timeline-entry');
  await expect(history.last()).toContainText('New inquiry → Spoken to');
  const kinds = ['received', 'opened', 'call', 'note', 'email-sent', 'viewed-by-homeowner', 'stage-moved'];
  await expect(history).toHaveCount(kinds.length);
  for (const [i, kind] of kinds.entries()) await expect(history.nth(i)).toHaveAttribute('data-kind', kind);
  const events = await query<{ kind: string }>(
    `select e.kind from lead_event e join lead l on l.id = e.lead_id where l.reference = $1 order by e.at, e.created_at`,
    [reference],
  );
  expect(events.map((e) => e.kind)).toEqual(kinds);

  // Back on Inquiries, the homeowner's phone typed with spaces finds it, no longer unread.
  await staff.goto('/app');
  await expect(staff.locator('astro-island[ssr]')).toHaveCount(0, { timeout: 15_000 });
  await staff.getByLabel(/^Search/).fill('512 555 0163');
  const found = staff.getByTestId('inquiry-row').filter({ hasText: name });
  await expect(found).toHaveCount(1);
  await expect(found).not.toContainText('Unread');
  await staff.close();
});
