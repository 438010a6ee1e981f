import { randomUUID } from 'node:crypto';
import { expect, test, type Page } from '@playwright/test';
import { query } from '../helpers/app-database';
import { DEMO_PASSWORD } from './helpers/staff';

/**
 * An inquiry of Sam's at Visit booked with a visit that began yesterday, copied in the database from
 * one of Cedar Hollow's demo inquiries priced from the homeowner's own sizes (the same inputs and
 * estimate), so no other test's inquiry is touched. Removed afterwards with its visit and history.
 */
async function inquiryWithPastVisit(): Promise<{ id: string; visitId: string }> {
  const [sam] = await query<{ id: string }>(
    `select m.id from membership m join app_user u on u.id = m.user_id join company c on c.id = m.company_id
     where c.slug = 'cedar-hollow' and u.email = 'sam@cedar-hollow.test'`,
  );
  const overrides = {
    id: randomUUID(),
    reference: `VO${randomUUID().slice(0, 4)}-${randomUUID().slice(0, 4)}`.toUpperCase(),
    idempotency_key: randomUUID(),
    name: 'Ansel Marlow',
    email: `ansel.${randomUUID().slice(0, 8)}@homeowner.test`,
    stage: 'visit-booked',
    assignee_id: sam!.id,
    deleted_at: null,
    merged_into_id: null,
    duplicate_of_id: null,
  };
  const [lead] = await query<{ id: string }>(
    `insert into lead
     select (jsonb_populate_record(null::lead, to_jsonb(l) || $1::jsonb || jsonb_build_object('created_at', now() - interval '3 days', 'updated_at', now()))).*
     from lead l join company c on c.id = l.company_id
     where c.slug = 'cedar-hollow' and l.deleted_at is null and l.estimate #>> '{data,takeoff,facts,measuredBy}' <> 'site-measure'
     order by l.created_at limit 1
     returning id`,
    [JSON.stringify(overrides)],
  );
  // Yesterday, an hour long with half an hour's travel after; the minutes vary so a rerun never meets an earlier one.
  const [visit] = await query<{ id: string }>(
    `insert into visit (id, company_id, lead_id, salesperson_id, starts_at, ends_at, blocked_until, status, booked_via)
     select gen_random_uuid(), company_id, id, $2, t, t + interval '1 hour', t + interval '90 minutes', 'booked', 'staff'
     from lead, (select date_trunc('minute', now()) - interval '26 hours' - (floor(random() * 240) || ' minutes')::interval as t) at
     where id = $1 returning id`,
    [lead!.id, sam!.id],
  );
  return { id: lead!.id, visitId: visit!.id };
}

async function signIn(page: Page, email: string) {
  await page.goto('/login');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/app$/);
}

/** "$4,350 – $5,900" → its two ends in whole units. */
function rangeEnds(text: string): [number, number] {
  const [low, high] = text.match(/[\d,]+(?:\.\d+)?/g)!.map((n) => Number(n.replace(/,/g, '')));
  return [low!, high ?? low!];
}

let inquiry: { id: string; visitId: string } | undefined;
test.afterEach(async () => {
  if (inquiry) await query(`delete from lead where id = $1`, [inquiry.id]);
});

test('a salesperson marks yesterday’s visit done, enters the measured rooms and sees the narrower range at Measured', async ({ page }) => {
  test.setTimeout(60_000);
  inquiry = await inquiryWithPastVisit();
  await signIn(page, 'sam@cedar-hollow.test');
  await page.goto(`/app/leads/${inquiry.id}`);
  await expect(page.locator('astro-island[ssr]')).toHaveCount(0);
  const range = page.getByTestId('lead-range');
  const [homeLow, homeHigh] = rangeEnds((await range.textContent())!);
  await expect(page.getByTestId('range-measured')).toHaveCount(0);

  const outcome = page.getByTestId('visit-outcome');
  await expect(outcome).toContainText('with Sam Okafor');
  await outcome.getByRole('button', { name: 'Mark done' }).click();

  // Done opens the measured rooms, starting from the homeowner's.
  const measured = page.getByTestId('measured-rooms');
  await expect(measured).toContainText('Site visit done');
  await expect(page.getByTestId('visit-outcome')).toHaveCount(0);
  await measured.getByRole('button', { name: 'Enter the measured rooms' }).click();
  const firstRoom = measured.getByTestId('room-0');
  const length = firstRoom.getByRole('textbox', { name: /^Room length/ });
  await expect(length).not.toHaveValue('');
  // On site the first room came out an inch longer than the homeowner said.
  const typed = (await length.inputValue()).trim();
  // The demo's rooms are whole feet (13'), so an inch more reads 13' 1".
  await length.fill(typed.endsWith("'") ? `${typed} 1"` : typed);
  await expect(measured.getByText('How did you get the sizes?')).toHaveCount(0);
  await measured.getByRole('button', { name: 'Save the measured rooms and re-price' }).click();

  await expect(page.getByTestId('range-measured')).toHaveText('site measurement');
  const [siteLow, siteHigh] = rangeEnds((await range.textContent())!);
  expect(siteHigh - siteLow).toBeLessThan(homeHigh - homeLow);
  await expect(page.getByLabel('Stage', { exact: true })).toHaveValue('measured');
  const history = page.getByTestId('timeline-entry');
  await expect(history.filter({ hasText: 'Visit done:' })).toHaveCount(1);
  await expect(history.filter({ hasText: 'Measured and re-priced' })).toContainText(/from a site measurement \(was .+ from the homeowner/);
  await expect(history.filter({ hasText: 'Visit booked → Measured' })).toHaveCount(1);
  await expect(measured).toContainText('The estimate is priced from a site measurement');
});
