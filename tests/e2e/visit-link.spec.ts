import ICAL from 'ical.js';
import { expect, test, type APIRequestContext } from '@playwright/test';
import { query } from '../helpers/app-database';
import { waitForMail, type ReceivedMail } from '../helpers/mailbox';
import { signedInAs } from './helpers/staff';

/**
 * A homeowner moves their site visit through the link in the invitation: the visit is booked by
 * a salesperson on the phone, the homeowner opens the link from the delivered e-mail, chooses
 * another time on the firm's clock, and both the homeowner and the salesperson get the changed
 * invitation (RFC 5545 §3.8.7.4 SEQUENCE 1, §3.8.2.4 the new DTSTART; read back with ical.js).
 */

// The second demo firm's owner, who takes visits there: no other browser test books that firm's visits.
const SALESPERSON = 'nora@northgate.test';
let addedAvailability: string[] = [];

test.afterAll(async () => {
  if (addedAvailability.length) await query(`delete from "availability" where "id" = any($1::uuid[])`, [addedAvailability]);
});

/** Gives the salesperson visiting hours every day unless the demo data already gave them some. */
async function ensureHours(membershipId: string, companyId: string): Promise<void> {
  const day = [{ from: '08:00', to: '18:00' }];
  const weekly = { mon: day, tue: day, wed: day, thu: day, fri: day, sat: day, sun: day };
  const added = await query<{ id: string }>(
    `insert into "availability" ("id", "company_id", "membership_id", "weekly") values (gen_random_uuid(), $1, $2, $3)
     on conflict ("membership_id") do nothing returning "id"`,
    [companyId, membershipId, JSON.stringify(weekly)],
  );
  addedAvailability = [...addedAvailability, ...added.map((row) => row.id)];
}

/** Books the first free of a few later slots (another browser worker may take one meanwhile). */
async function bookLater(staff: APIRequestContext, leadId: string, salespersonId: string): Promise<{ id: string; start: string }> {
  const { slots } = (await (await staff.get(`/api/app/visits/slots?salespersonId=${salespersonId}`)).json()) as { slots: { start: string }[] };
  expect(slots.length).toBeGreaterThan(20);
  const offset = 8 + Math.floor(Math.random() * Math.min(40, slots.length - 12));
  for (const slot of slots.slice(offset, offset + 4)) {
    const answer = await staff.post(`/api/app/leads/${leadId}/visits`, { data: { start: slot.start, salespersonId } });
    if (answer.status() === 201) return answer.json();
    expect(answer.status()).toBe(409);
  }
  throw new Error('No slot could be booked');
}

function invitationOf(mail: ReceivedMail) {
  const part = mail.parts.find((p) => p.contentType === 'text/calendar');
  expect(part?.params.method).toBe('REQUEST');
  const event = new ICAL.Component(ICAL.parse(part!.content)).getFirstSubcomponent('vevent')!;
  return {
    uid: event.getFirstPropertyValue('uid'),
    sequence: event.getFirstPropertyValue('sequence'),
    start: (event.getFirstPropertyValue('dtstart') as ICAL.Time).toJSDate().toISOString(),
  };
}

test('a homeowner moves their visit through the link in the e-mail, and both people get the changed invitation', async ({ page }) => {
  test.setTimeout(90_000);
  const suffix = Date.now().toString(36);
  const name = `Tamsin Orrell ${suffix}`;
  const email = `tamsin-${suffix}@example.test`;
  const [person] = await query<{ membership_id: string; company_id: string; time_zone: string }>(
    `select m."id" as membership_id, m."company_id", c."time_zone" from "membership" m
       join "app_user" u on u."id" = m."user_id" join "company" c on c."id" = m."company_id" where u."email" = $1`,
    [SALESPERSON],
  );
  await ensureHours(person!.membership_id, person!.company_id);

  // The homeowner phones; the salesperson takes the inquiry and books a visit.
  const staff = await signedInAs(SALESPERSON);
  const created = await staff.post('/api/app/leads', {
    data: {
      idempotencyKey: `visit-link-e2e-${suffix}`,
      project: {
        rooms: [{ name: 'Stairwell', ceilingHeight: 96, walls: [{ length: 144 }], treatment: { id: 'beadboard', height: 'wainscot' } }],
        builtBefore1978: 'no',
        measuredBy: 'homeowner-tape',
      },
      contact: { name, email, phone: '(512) 555-0188', address: '9 Wren Close', postcode: '02139', preferredContact: 'phone', consent: true },
    },
  });
  expect(created.status()).toBe(201);
  const { lead } = await created.json();
  const booked = await bookLater(staff, lead.id, person!.membership_id);
  await staff.dispose();

  // The invitation arrives with the link.
  const invitation = await waitForMail({ to: email, subject: 'Your site visit with', timeoutMs: 20_000 });
  expect(invitationOf(invitation)).toMatchObject({ sequence: 0, start: booked.start });
  const link = invitation.text.match(/https?:\/\/\S+\/visit\/[0-9a-f-]{36}\.[A-Za-z0-9_-]{43}/)?.[0];
  expect(link, invitation.text).toBeTruthy();

  // The homeowner opens it: no sign-in, the time on the firm's clock labelled with its zone.
  const opened = await page.goto(new URL(link!).pathname);
  expect(opened?.status()).toBe(200);
  expect(opened?.headers()['referrer-policy']).toBe('no-referrer');
  await expect(page.getByRole('heading', { name: 'Your site visit' })).toBeVisible();
  // Source: IANA tz database (America/New_York: EST or EDT).
  await expect(page.getByTestId('visit-when')).toHaveText(/ (EST|EDT)$/);
  await expect(page.getByText(person!.time_zone)).toBeVisible();
  await expect(page.getByText('9 Wren Close, 02139')).toBeVisible();
  await expect(page.locator('astro-island[ssr]')).toHaveCount(0, { timeout: 15_000 });

  // Another time: the last day offered, its last time.
  await page.getByRole('button', { name: 'Choose another time' }).click();
  const day = page.getByLabel('Day');
  const lastDay = await day.locator('option').last().getAttribute('value');
  await day.selectOption(lastDay!);
  await page.getByRole('radio').last().check();
  await page.getByRole('button', { name: /^Move my visit to/ }).click();
  await expect(page.getByTestId('visit-status')).toContainText('Done: your visit is now on', { timeout: 15_000 });

  const [stored] = await query<{ starts_at: Date; sequence: number }>(`select "starts_at", "sequence" from "visit" where "id" = $1`, [booked.id]);
  const newStart = new Date(stored!.starts_at).toISOString();
  expect(newStart).not.toBe(booked.start);
  expect(stored!.sequence).toBe(1);

  // Both get the changed invitation: same UID, SEQUENCE 1, the new start.
  const forHomeowner = invitationOf(await waitForMail({ to: email, subject: 'has moved to', timeoutMs: 20_000 }));
  const forSalesperson = invitationOf(await waitForMail({ to: SALESPERSON, subject: `Site visit moved: ${name}`, timeoutMs: 20_000 }));
  for (const changed of [forHomeowner, forSalesperson]) {
    expect(changed).toEqual({ uid: invitationOf(invitation).uid, sequence: 1, start: newStart });
  }
});

test('a forged link is a plain 404, and a post from another site is refused', async ({ request }) => {
  const forged = await request.get(`/visit/00000000-0000-4000-8000-000000000000.${'A'.repeat(43)}`);
  expect(forged.status()).toBe(404);
  expect(await forged.text()).toContain('This link does not open a visit');
  const crossSite = await request.post(`/api/visit/00000000-0000-4000-8000-000000000000.${'A'.repeat(43)}/cancel`, {
    headers: { Origin: 'https://elsewhere.test', 'Sec-Fetch-Site': 'cross-site' },
    data: {},
  });
  expect(crossSite.status()).toBe(403);
});
