import { afterAll, afterEach, beforeAll, describe, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import { getOrm } from '../../src/lib/server/boot/orm';
import { OutboxMail } from '../../src/lib/server/mail/outbox-mail.entity';
import { cancelVisit, moveVisit } from '../../src/lib/server/visits/booking';
import { Visit } from '../../src/lib/server/visits/visit.entity';
import { sendDueVisitReminders, visitRemindersJob } from '../../src/lib/server/visits/visit-reminders';
import { useFakeClock } from '../helpers/fake-clock';
import { bookAsStaff, visitFirm, visitLead, type VisitFirm } from '../helpers/visit-firm';

// Source: IANA tz database, America/New_York: daylight time begins at 02:00 on the second Sunday of
// March, in 2026 on Sunday 8 March (EST, UTC−5, before; EDT, UTC−4, after). So a visit on Monday
// 9 March is reminded at 09:00 EDT on Sunday 8 March = 13:00Z, not 14:00Z as 09:00 EST would be.
// The reminder's time of day, 09:00 the day before, is a product choice (no source).

let orm: MikroORM;
beforeAll(async () => {
  orm = await getOrm();
});
afterAll(async () => {
  await orm.close();
});
const em = () => orm.em.fork();

let clock: ReturnType<typeof useFakeClock> | undefined;
afterEach(() => clock?.restore());

const everyDay = [{ from: '09:00', to: '17:00' }];
const allWeek = { mon: everyDay, tue: everyDay, wed: everyDay, thu: everyDay, fri: everyDay, sat: everyDay, sun: everyDay };

/** Reminders queued so far to the visit's homeowner and salesperson. */
async function remindersTo(firm: VisitFirm, homeowner: string): Promise<OutboxMail[]> {
  return em().find(OutboxMail, { toAddress: { $in: [homeowner, firm.sid.email] }, subject: { $like: 'Reminder:%' } }, { orderBy: { createdAt: 'asc' } });
}

const run = (at: string) => sendDueVisitReminders(em(), { now: new Date(at) });

/** A visit on Monday 9 March 2026 at 10:00 EDT (14:00Z), booked a week ahead. */
async function mondayVisit() {
  clock = useFakeClock('2026-03-02T15:00:00Z');
  const firm = await visitFirm(em(), { weekly: allWeek });
  const lead = await visitLead(em(), firm);
  const visit = await bookAsStaff(em(), firm, lead.id, '2026-03-09T14:00:00.000Z');
  return { firm, lead, visit };
}

describe('visit reminders', () => {
  test('across the change to daylight time: not before 09:00 EDT the day before, once at it, and never twice', async () => {
    const { firm, lead, visit } = await mondayVisit();
    expect(visit.reminderDueAt?.toISOString()).toBe('2026-03-08T13:00:00.000Z');

    await run('2026-03-08T12:59:59Z');
    expect(await remindersTo(firm, lead.email)).toHaveLength(0);

    await run('2026-03-08T13:00:00Z');
    const sent = await remindersTo(firm, lead.email);
    expect(sent.map((m) => m.toAddress).sort()).toEqual([lead.email, firm.sid.email].sort());
    expect(sent.find((m) => m.toAddress === lead.email)).toMatchObject({ fromName: firm.company.name, replyTo: firm.company.contactEmail, calendar: null });
    for (const mail of sent) expect(mail.textBody).toContain('Mon, Mar 9, 2026, 10:00 AM EDT');
    expect((await em().findOneOrFail(Visit, { id: visit.id })).reminderSentAt?.toISOString()).toBe('2026-03-08T13:00:00.000Z');

    await run('2026-03-08T13:01:00Z');
    // The scheduled job itself, on the server's clock.
    clock!.set('2026-03-08T13:05:00Z');
    await visitRemindersJob.run({}, { em: em(), send: async () => null });
    expect(await remindersTo(firm, lead.email)).toHaveLength(2);
  });

  test('two runs at the same moment send it once', async () => {
    const { firm, lead } = await mondayVisit();
    await Promise.all([run('2026-03-08T13:00:00Z'), run('2026-03-08T13:00:00Z'), run('2026-03-08T13:00:30Z')]);
    const sent = await remindersTo(firm, lead.email);
    expect(sent.map((m) => m.toAddress).sort()).toEqual([lead.email, firm.sid.email].sort());
  });

  test('a moved visit is reminded again, for its new time', async () => {
    const { firm, lead, visit } = await mondayVisit();
    await run('2026-03-08T13:00:00Z');
    expect(await remindersTo(firm, lead.email)).toHaveLength(2);
    // On Sunday afternoon the visit moves to Wednesday 11 March, 10:00 EDT.
    clock!.set('2026-03-08T18:00:00Z');
    const moved = await moveVisit(em(), { companyId: firm.company.id, visitId: visit.id, start: new Date('2026-03-11T14:00:00.000Z'), by: 'staff' });
    expect([moved.reminderDueAt?.toISOString(), moved.reminderSentAt]).toEqual(['2026-03-10T13:00:00.000Z', null]);
    await run('2026-03-10T12:59:00Z');
    expect(await remindersTo(firm, lead.email)).toHaveLength(2);
    await run('2026-03-10T13:00:00Z');
    const again = (await remindersTo(firm, lead.email)).slice(2);
    expect(again).toHaveLength(2);
    for (const mail of again) expect(mail.textBody).toContain('Wed, Mar 11, 2026, 10:00 AM EDT');
  });

  test('a cancelled visit is never reminded', async () => {
    const { firm, lead, visit } = await mondayVisit();
    await cancelVisit(em(), { companyId: firm.company.id, visitId: visit.id, by: 'homeowner' });
    await run('2026-03-08T13:00:00Z');
    await run('2026-03-09T13:00:00Z');
    expect(await remindersTo(firm, lead.email)).toHaveLength(0);
    expect((await em().findOneOrFail(Visit, { id: visit.id })).reminderSentAt).toBeNull();
  });

  test('a visit booked in the evening for the next morning is reminded at once', async () => {
    // Tuesday 10 March 2026, 20:00 EDT, for Wednesday 09:00 EDT.
    clock = useFakeClock('2026-03-11T00:00:00Z');
    const firm = await visitFirm(em(), { weekly: allWeek });
    const lead = await visitLead(em(), firm);
    const visit = await bookAsStaff(em(), firm, lead.id, '2026-03-11T13:00:00.000Z');
    expect(visit.reminderDueAt?.toISOString()).toBe('2026-03-11T00:00:00.000Z');
    await run('2026-03-11T00:00:00Z');
    const sent = await remindersTo(firm, lead.email);
    expect(sent).toHaveLength(2);
    expect(sent[0]!.textBody).toContain('Wed, Mar 11, 2026, 9:00 AM EDT');
  });
});
