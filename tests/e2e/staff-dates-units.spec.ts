import { randomBytes } from 'node:crypto';
import { expect, test } from '@playwright/test';
import { query } from '../helpers/app-database';
import { DEMO_PASSWORD } from './helpers/staff';

/**
 * A firm in Chicago that measures in millimetres, with one inquiry sent at 01:19 UTC on Dec 2,
 * when it was still the evening of Dec 1 at the firm. Built from the demo firm's rows (its
 * published numbers with metric units, one of its leads with boards), so it is a real firm to every reader.
 * Dated ahead of today so it is the newest on the list whatever day the suite runs.
 */
const SENT_AT = '2030-12-02T01:19:00Z';
const tag = randomBytes(4).toString('hex');
const email = `clock-${tag}@clockwise.test`;
let leadId: string;

test.beforeAll(async () => {
  const [firm] = await query<{ id: string }>(
    `insert into company (id, slug, name, time_zone) values (gen_random_uuid(), $1, $2, 'America/Chicago') returning id`,
    [`clockwise-${tag}`, `Clockwise Panels ${tag}`],
  );
  await query(
    `with person as (
       insert into app_user (id, email, name, password_hash)
       select gen_random_uuid(), $2, 'Cleo Clockwise', password_hash from app_user where email = 'olive@cedar-hollow.test'
       returning id)
     insert into membership (id, company_id, user_id, role) select gen_random_uuid(), $1, id, 'sales' from person`,
    [firm!.id, email],
  );
  const [version] = await query<{ id: string }>(
    `insert into rate_book_version (id, company_id, number, status, data, published_at)
     select gen_random_uuid(), $1, 1, 'published', jsonb_set(v.data, '{data,units}', '"metric"'), now()
       from rate_book_version v join company c on c.id = v.company_id
      where c.slug = 'cedar-hollow' and v.status = 'published'
     returning id`,
    [firm!.id],
  );
  const [lead] = await query<{ id: string }>(
    `insert into lead (id, created_at, company_id, reference, name, email, phone, address, postcode, preferred_contact,
                       consent_at, inputs, estimate, rate_book_version_id, range_low_cents, range_high_cents, idempotency_key, view_token_hash)
     select gen_random_uuid(), $2, $1, $3, 'Dana Evening', 'dana@clockwise.test', l.phone, l.address, l.postcode, l.preferred_contact,
            $2, l.inputs, l.estimate, $4, l.range_low_cents, l.range_high_cents, $5, $6
       from lead l join company c on c.id = l.company_id
      -- one whose takeoff lays boards, so a last board's width is on the page
      where c.slug = 'cedar-hollow' and l.estimate::text like '%"lastWidth"%'
      order by l.reference limit 1
     returning id`,
    [firm!.id, SENT_AT, `CK${tag.slice(0, 6).toUpperCase()}`, version!.id, randomBytes(12).toString('hex'), randomBytes(32).toString('hex')],
  );
  leadId = lead!.id;
});

test('the list and the inquiry page agree on the day in the firm’s zone, and lengths come in the firm’s units', async ({ page }) => {
  await page.goto('/login');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/app$/);

  // Source: IANA tz database, northamerica: America/Chicago is UTC-6 (CST) in December, so
  // 01:19 UTC on Dec 2 is 7:19 PM on Dec 1 there.
  const row = page.getByRole('row', { name: /Dana Evening/ });
  await expect(row.getByTestId('lead-received')).toHaveText('Dec 1');
  await expect(row.getByTestId('lead-received')).toHaveAttribute('datetime', '2030-12-01T19:19:00-06:00');

  await row.getByRole('link', { name: 'Dana Evening' }).click();
  // The list's link carries the view it came from (`?in=`), for Previous and Next.
  await expect(page).toHaveURL(new RegExp(`/app/leads/${leadId}(\\?in=|$)`));
  await expect(page.getByTestId('lead-received')).toHaveText('Dec 1, 2030, 7:19 PM');
  await expect(page.getByTestId('lead-received')).toHaveAttribute('datetime', '2030-12-01T19:19:00-06:00');

  // The firm measures in millimetres: areas in m², the last board's width in mm, never inches.
  await expect(page.getByTestId('room-net-area').first()).toHaveText(/^\d+(\.\d)? m² net$/);
  for (const caption of await page.getByTestId('wall-caption').allTextContents()) {
    expect(caption).not.toMatch(/\d"|\d in\b/);
  }
  await expect(page.getByTestId('wall-caption').filter({ hasText: 'boards, last' }).first()).toHaveText(/boards, last \d+ mm/);
});
