import { execFileSync } from 'node:child_process';
import ICAL from 'ical.js';
import { expect, test } from '@playwright/test';
import { query } from '../helpers/app-database';
import { mailTo, waitForMail, type ReceivedMail } from '../helpers/mailbox';
import { openWidgetOnDemoSite, priceAndSend } from './helpers/embed';
import { DEMO_PASSWORD } from './helpers/staff';

/**
 * A site visit from start to end, as the people involved see it: a homeowner books a time in the
 * price widget, the salesperson finds it on their week, the homeowner moves it through the link in
 * the invitation, both get the changed invitation, and the day-before reminder goes out once, at
 * 09:00 on the firm's clock the day before (the job run with the clock set, since a browser test
 * cannot move the server's).
 * Sources: RFC 5545 §3.8.4.7 UID, §3.8.7.4 SEQUENCE, §3.8.2.4 DTSTART (read back with ical.js);
 * the reminder time is Lapwing's own rule.
 */

const TIME_ZONE = 'America/Chicago';

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

/** The wall clock and date of an instant in the firm's zone, by the browser-independent Intl API. */
function onFirmClock(at: Date) {
  const parts = Object.fromEntries(
    new Intl.DateTimeFormat('en-CA', {
      timeZone: TIME_ZONE,
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      hourCycle: 'h23',
    })
      .formatToParts(at)
      .map((p) => [p.type, p.value]),
  );
  return { date: `${parts.year}-${parts.month}-${parts.day}`, time: `${parts.hour}:${parts.minute}` };
}

function runReminders(at: Date, addresses: string[]): void {
  execFileSync('node_modules/.bin/tsx', ['tests/helpers/run-visit-reminders.ts', at.toISOString(), ...addresses], { env: process.env, stdio: 'pipe' });
}

const remindersTo = async (address: string) => (await mailTo(address)).filter((m) => m.subject.startsWith('Reminder:')).length;

test('booked in the widget, on the salesperson’s week, moved by the homeowner’s link, reminded once the day before', async ({ page, browser }) => {
  test.setTimeout(180_000);
  const suffix = Date.now().toString(36);
  const name = `Isolde Brackwater ${suffix}`;
  const email = `isolde-${suffix}@example.test`;

  // The homeowner prices a room, sends it and books the first open time offered.
  const widget = await openWidgetOnDemoSite(page, { width: 390, height: 844 });
  await priceAndSend(page, widget, email, name);
  const step = widget.getByTestId('visit-step');
  await step.getByRole('button', { name: 'Show open times' }).click();
  await step
    .getByRole('group', { name: /^Times on / })
    .locator('label')
    .first()
    .click();
  await step.getByRole('button', { name: 'Book this time' }).click();
  await expect(widget.getByTestId('visit-booked')).toContainText('Booked:');
  const [visit] = await query<{ id: string; starts_at: Date; salesperson: string; salesperson_name: string }>(
    `select v.id, v.starts_at, u.email as salesperson, u.name as salesperson_name
       from visit v join lead l on l.id = v.lead_id join membership m on m.id = v.salesperson_id join app_user u on u.id = m.user_id
      where l.email = $1 and v.status = 'booked'`,
    [email],
  );
  expect(visit).toBeTruthy();

  // The salesperson signs in and finds it on the week of that day.
  const staff = await browser.newPage();
  await staff.goto('/login');
  await staff.getByLabel('E-mail').fill(visit!.salesperson);
  await staff.getByLabel('Password').fill(DEMO_PASSWORD);
  await staff.getByRole('button', { name: 'Sign in' }).click();
  await expect(staff).toHaveURL(/\/app$/);
  await staff.goto(`/app/visits?date=${onFirmClock(visit!.starts_at).date}`);
  const block = staff.getByTestId('week-view').getByTestId('visit-block').filter({ hasText: name });
  await expect(block).toBeVisible();
  await staff.close();

  // The invitation reaches the homeowner with a link to move the visit; they choose the last time offered.
  const invitation = await waitForMail({ to: email, subject: 'Your site visit with', timeoutMs: 30_000 });
  expect(invitationOf(invitation)).toMatchObject({ sequence: 0, start: visit!.starts_at.toISOString() });
  const link = invitation.text.match(/https?:\/\/\S+\/visit\/[0-9a-f-]{36}\.[A-Za-z0-9_-]{43}/)?.[0];
  expect(link, invitation.text).toBeTruthy();
  await page.setViewportSize({ width: 1024, height: 800 });
  await page.goto(new URL(link!).pathname);
  await expect(page.locator('astro-island[ssr]')).toHaveCount(0, { timeout: 15_000 });
  await page.getByRole('button', { name: 'Choose another time' }).click();
  const day = page.getByLabel('Day');
  await day.selectOption((await day.locator('option').last().getAttribute('value'))!);
  await page.getByRole('radio').last().check();
  await page.getByRole('button', { name: /^Move my visit to/ }).click();
  await expect(page.getByTestId('visit-status')).toContainText('Done: your visit is now on', { timeout: 15_000 });
  const [moved] = await query<{ starts_at: Date; reminder_due_at: Date; reminder_sent_at: Date | null }>(
    `select starts_at, reminder_due_at, reminder_sent_at from visit where id = $1`,
    [visit!.id],
  );
  const newStart = moved!.starts_at.toISOString();
  expect(newStart).not.toBe(visit!.starts_at.toISOString());

  // Both people get the changed invitation: the same UID, SEQUENCE 1, the new start.
  const uid = invitationOf(invitation).uid;
  expect(invitationOf(await waitForMail({ to: email, subject: 'has moved to', timeoutMs: 30_000 }))).toEqual({ uid, sequence: 1, start: newStart });
  expect(invitationOf(await waitForMail({ to: visit!.salesperson, subject: `Site visit moved: ${name}`, timeoutMs: 30_000 }))).toEqual({
    uid,
    sequence: 1,
    start: newStart,
  });

  // The reminder is due at 09:00 on the firm's clock, the local day before the new time.
  const due = moved!.reminder_due_at;
  const dayBefore = new Date(Date.parse(`${onFirmClock(moved!.starts_at).date}T12:00:00Z`) - 86_400_000).toISOString().slice(0, 10);
  expect(onFirmClock(due)).toEqual({ date: dayBefore, time: '09:00' });
  expect(moved!.reminder_sent_at).toBeNull();

  // A minute early: nothing. At the time: one reminder. Run again: still one.
  runReminders(new Date(due.getTime() - 60_000), [email]);
  expect((await query<{ reminder_sent_at: Date | null }>(`select reminder_sent_at from visit where id = $1`, [visit!.id]))[0]!.reminder_sent_at).toBeNull();
  runReminders(due, [email]);
  const reminder = await waitForMail({ to: email, subject: 'Reminder: your site visit with', timeoutMs: 30_000 });
  expect(reminder.text).toContain(visit!.salesperson_name.split(' ')[0]!);
  runReminders(new Date(due.getTime() + 60_000), [email]);
  expect(await remindersTo(email)).toBe(1);
});
