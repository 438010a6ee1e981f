import { randomUUID } from 'node:crypto';
import { expect, test, type Page } from '@playwright/test';
import { instantToLocalInput } from '../../src/lib/shared/zone-input';
import { query } from '../helpers/app-database';
import { DEMO_PASSWORD } from './helpers/staff';

/**
 * A fresh inquiry of Cedar Hollow's, copied in the database from one of its demo inquiries (the
 * same inputs and estimate) as a new, unread, unassigned one, so no other test's inquiry is touched.
 * Not sent through the widget: its per-address limit on sends is shared by every browser test.
 */
async function freshInquiry(): Promise<{ id: string; reference: string }> {
  const reference = `FL${randomUUID().slice(0, 4)}-${randomUUID().slice(0, 4)}`.toUpperCase();
  const overrides = {
    id: randomUUID(),
    reference,
    idempotency_key: randomUUID(),
    name: 'Wren Calloway',
    email: `wren.${randomUUID().slice(0, 8)}@homeowner.test`,
    phone: '+15125550183',
    stage: 'new',
    opened_at: null,
    assignee_id: null,
    lost_reason: null,
    next_follow_up_at: null,
    first_contact_at: null,
    last_contact_at: null,
    deleted_at: null,
    draft_id: null,
  };
  const [lead] = await query<{ id: string }>(
    `insert into lead
     select (jsonb_populate_record(null::lead, to_jsonb(l) || $1::jsonb || jsonb_build_object('created_at', now(), 'updated_at', now()))).*
     from lead l join company c on c.id = l.company_id
     where c.slug = 'cedar-hollow' and l.deleted_at is null order by l.created_at limit 1
     returning id`,
    [JSON.stringify(overrides)],
  );
  await query(
    `insert into lead_event (id, company_id, lead_id, kind, at, data)
     select gen_random_uuid(), company_id, id, 'received', created_at, '{"source":"widget"}'::jsonb from lead where id = $1`,
    [lead!.id],
  );
  return { id: lead!.id, reference };
}

async function signIn(page: Page, email: string) {
  await page.goto('/login');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/app$/);
}

test('a salesperson moves an inquiry through its stages, undoes a skip, assigns it and sets a follow-up; the history shows each in order', async ({ page }) => {
  test.setTimeout(60_000);
  const inquiry = await freshInquiry();
  await signIn(page, 'sam@cedar-hollow.test');
  await page.goto(`/app/leads/${inquiry.id}`);
  await expect(page).toHaveTitle(new RegExp(`^Inquiry ${inquiry.reference}`));
  await expect(page.locator('astro-island[ssr]')).toHaveCount(0);

  // The contact block: the phone as the firm dials it, and links to call, text and e-mail.
  const contact = page.getByTestId('contact-block');
  await expect(contact.getByTestId('contact-phone')).toHaveText('(512) 555-0183');
  await expect(contact.getByRole('link', { name: 'Call' })).toHaveAttribute('href', 'tel:+15125550183');
  await expect(contact.getByRole('link', { name: 'Text' })).toHaveAttribute('href', 'sms:+15125550183');

  const stage = page.getByLabel('Stage', { exact: true });
  const history = page.getByTestId('timeline-entry');

  await stage.selectOption({ label: 'Spoken to' });
  await expect(history.last()).toContainText('New inquiry → Spoken to');

  // A skip asks first.
  await stage.selectOption({ label: 'Going ahead' });
  const dialog = page.getByRole('dialog', { name: 'Move to Going ahead?' });
  await expect(dialog).toContainText('This skips Visit booked, Measured, Quote sent.');
  await dialog.getByRole('button', { name: 'Move anyway' }).click();
  await expect(dialog).toBeHidden();
  await expect(history.last()).toContainText('Spoken to → Going ahead');
  await expect(stage).toHaveValue('going-ahead');

  // Undone from the history: the stage goes back and the entry stays, marked.
  await history.last().getByRole('button', { name: /^Undo/ }).click();
  await expect(stage).toHaveValue('spoken-to');
  await expect(history.last()).toContainText('Undone by Sam Okafor');
  await expect(history.last().getByRole('button', { name: /^Undo/ })).toHaveCount(0);

  // Not going ahead asks for the reason.
  await stage.selectOption({ label: 'Not going ahead' });
  const reasonDialog = page.getByRole('dialog', { name: 'Move to Not going ahead?' });
  await reasonDialog.getByRole('button', { name: 'Move to Not going ahead' }).click();
  await expect(reasonDialog).toContainText('Choose why it is not going ahead.');
  await reasonDialog.getByLabel('Why is it not going ahead?').selectOption('Timing');
  await reasonDialog.getByRole('button', { name: 'Move to Not going ahead' }).click();
  await expect(reasonDialog).toBeHidden();
  await expect(page.getByTestId('inquiry-controls')).toContainText('Reason: Timing');
  await expect(history.last()).toContainText('Spoken to → Not going ahead (reason: Timing)');

  await page.getByLabel('Assigned to').selectOption({ label: 'Rhea Lindqvist' });
  await expect(history.last()).toContainText('Assigned to Rhea Lindqvist');

  // Tomorrow at 9:30 on the firm's clock (Cedar Hollow keeps Chicago time).
  const tomorrow = instantToLocalInput(Date.now() + 24 * 60 * 60 * 1000, 'America/Chicago').slice(0, 10);
  await page.getByLabel('Next follow-up').fill(`${tomorrow}T09:30`);
  await page.getByRole('button', { name: 'Set', exact: true }).click();
  await expect(page.getByTestId('follow-up-note')).toContainText('9:30 AM. A reminder e-mail goes to Rhea Lindqvist then.');
  await expect(history.last()).toContainText('Follow up on');

  const expected = [
    ['received', 'Sent through the price widget'],
    ['opened', 'Opened on the staff side'],
    ['stage-moved', 'New inquiry → Spoken to'],
    ['stage-moved', 'Spoken to → Going ahead'],
    ['stage-moved', 'Spoken to → Not going ahead (reason: Timing)'],
    ['assigned', 'Assigned to Rhea Lindqvist'],
    ['follow-up-set', '9:30 AM'],
  ];
  await expect(history).toHaveCount(expected.length);
  for (const [index, [kind, text]] of expected.entries()) {
    await expect(history.nth(index)).toHaveAttribute('data-kind', kind!);
    await expect(history.nth(index)).toContainText(text!);
  }

  // The same history after a reload, from the server.
  await page.reload();
  await expect(history).toHaveCount(expected.length);
  await expect(page.getByLabel('Stage', { exact: true })).toHaveValue('not-going-ahead');
});

test('the print view shows the contact and the estimate without the menu, the controls or the history', async ({ page }) => {
  const inquiry = await freshInquiry();
  await signIn(page, 'olive@cedar-hollow.test');
  await page.goto(`/app/leads/${inquiry.id}`);
  await page.emulateMedia({ media: 'print' });
  await expect(page.getByRole('navigation', { name: 'Staff area' })).toBeHidden();
  await expect(page.getByTestId('inquiry-controls')).toBeHidden();
  await expect(page.getByTestId('timeline')).toBeHidden();
  await expect(page.getByTestId('contact-block')).toBeVisible();
  await expect(page.getByTestId('lead-range')).toBeVisible();
  await expect(page.getByTestId('print-status')).toContainText('Stage: New inquiry · Assigned to: Nobody yet');
  await expect(page.getByTestId('room-choices')).toBeVisible();

  await page.emulateMedia({ media: 'screen' });
  await page.goto(`/app/leads/${inquiry.id}?print=1`);
  await expect(page.getByRole('navigation', { name: 'Staff area' })).toBeHidden();
  await expect(page.getByTestId('inquiry-controls')).toBeHidden();
  await expect(page.getByTestId('contact-block')).toBeVisible();
  await expect(page.getByTestId('print-status')).toBeVisible();
});

test('the owner edits the reasons for not going ahead, and the stage control offers the new list', async ({ page }) => {
  const inquiry = await freshInquiry();
  await signIn(page, 'olive@cedar-hollow.test');
  await page.goto('/app/setup/lost-reasons');
  await expect(page.locator('astro-island[ssr]')).toHaveCount(0);
  await page.getByRole('button', { name: 'Add a reason' }).click();
  await page.getByLabel('Reason 7').fill('price');
  await page.getByRole('button', { name: 'Save reasons' }).click();
  await expect(page.getByText('This reason is already on the list.')).toBeVisible();
  await page.getByLabel('Reason 7').fill('Waiting on their insurance');
  await page.getByRole('button', { name: 'Save reasons' }).click();
  await expect(page.getByRole('status')).toContainText('Saved.');

  try {
    await page.goto(`/app/leads/${inquiry.id}`);
    await expect(page.locator('astro-island[ssr]')).toHaveCount(0);
    await page.getByLabel('Stage', { exact: true }).selectOption({ label: 'Not going ahead' });
    await page.getByLabel('Why is it not going ahead?').selectOption('Waiting on their insurance');
    await page.getByRole('button', { name: 'Move to Not going ahead' }).click();
    await expect(page.getByTestId('inquiry-controls')).toContainText('Reason: Waiting on their insurance');
  } finally {
    // Back to the defaults, so the role matrix and other tests meet the firm as seeded.
    await page.goto('/app/setup/lost-reasons');
    await expect(page.locator('astro-island[ssr]')).toHaveCount(0);
    await page.getByRole('button', { name: 'Remove “Waiting on their insurance”' }).click();
    await page.getByRole('button', { name: 'Save reasons' }).click();
    await expect(page.getByRole('status')).toContainText('Saved.');
  }
});
