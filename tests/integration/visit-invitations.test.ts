import ICAL from 'ical.js';
import { afterAll, afterEach, beforeAll, describe, expect, test } from 'vitest';
import type { MikroORM } from '@mikro-orm/postgresql';
import { getOrm } from '../../src/lib/server/boot/orm';
import { cancelVisit, moveVisit } from '../../src/lib/server/visits/booking';
import { Visit } from '../../src/lib/server/visits/visit.entity';
import { visitUid } from '../../src/lib/server/visits/visit-mails';
import { mailTo, type ReceivedMail } from '../helpers/mailbox';
import { deliverMailTo } from '../helpers/outbox';
import { useFakeClock } from '../helpers/fake-clock';
import { bookAsStaff, visitFirm, visitLead } from '../helpers/visit-firm';

// What is checked against the standards: RFC 5545 (iCalendar) for the file's properties, RFC 5546
// (iTIP) for what REQUEST and CANCEL mean, RFC 6047 (iMIP) §2.4 for the text/calendar part and its
// method parameter. The file is read back by ical.js, a parser independent of the `ics` package
// that writes it. Times: IANA tz database, America/New_York is UTC−5 (EST) in January.

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

/** Waits until `count` messages for `to` have reached the SMTP stand-in; returns them oldest first. */
async function mailsFor(to: string, count: number): Promise<ReceivedMail[]> {
  const deadline = Date.now() + 10_000;
  for (;;) {
    const found = await mailTo(to);
    if (found.length >= count) return found;
    if (Date.now() > deadline) throw new Error(`Only ${found.length} of ${count} e-mails to ${to} arrived`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

/** The message's text/calendar part (RFC 6047 §2.4), read by ical.js: the calendar and its one event. */
function invitationOf(mail: ReceivedMail) {
  const part = mail.parts.find((p) => p.contentType === 'text/calendar');
  expect(part, `a text/calendar part in "${mail.subject}"`).toBeDefined();
  const calendar = new ICAL.Component(ICAL.parse(part!.content));
  const events = calendar.getAllSubcomponents('vevent');
  expect(events).toHaveLength(1);
  const event = events[0]!;
  const utc = (name: string) => (event.getFirstPropertyValue(name) as ICAL.Time).toJSDate().toISOString();
  return {
    part,
    calendar,
    method: calendar.getFirstPropertyValue('method'),
    uid: event.getFirstPropertyValue('uid'),
    sequence: event.getFirstPropertyValue('sequence'),
    status: event.getFirstPropertyValue('status'),
    start: utc('dtstart'),
    end: utc('dtend'),
    stamp: utc('dtstamp'),
    location: event.getFirstPropertyValue('location'),
    organizer: String(event.getFirstPropertyValue('organizer')).toLowerCase(),
    attendees: event.getAllProperties('attendee').map((p) => String(p.getFirstValue()).toLowerCase()),
  };
}

describe('invitations for a visit: booked, moved, cancelled', () => {
  test('the homeowner and the salesperson each get a REQUEST, then a REQUEST with SEQUENCE 1 at the new time, then a CANCEL with SEQUENCE 2', async () => {
    // Monday 4 January 2027, 07:00 EST.
    clock = useFakeClock('2027-01-04T12:00:00Z');
    const firm = await visitFirm(em());
    const lead = await visitLead(em(), firm);
    const homeowner = lead.email;
    const salesperson = firm.sid.email;

    const visit = await bookAsStaff(em(), firm, lead.id, '2027-01-05T14:00:00.000Z'); // Tuesday 09:00 EST
    await deliverMailTo(em(), [homeowner, salesperson]);
    clock.set('2027-01-04T13:30:00Z');
    await moveVisit(em(), { companyId: firm.company.id, visitId: visit.id, start: new Date('2027-01-06T19:00:00.000Z'), by: 'staff' }); // Wednesday 14:00 EST
    await deliverMailTo(em(), [homeowner, salesperson]);
    clock.set('2027-01-04T15:00:00Z');
    await cancelVisit(em(), { companyId: firm.company.id, visitId: visit.id, by: 'staff' });
    await deliverMailTo(em(), [homeowner, salesperson]);

    const uid = visitUid(visit.id);
    for (const to of [homeowner, salesperson]) {
      const [booked, moved, cancelled] = (await mailsFor(to, 3)).map(invitationOf);
      // Source: RFC 6047 §2.4 (the text/calendar part names the iTIP method); RFC 5546 §1.4 (REQUEST, CANCEL)
      expect([booked!.part!.params.method, moved!.part!.params.method, cancelled!.part!.params.method]).toEqual(['REQUEST', 'REQUEST', 'CANCEL']);
      // Source: RFC 5545 §3.7.2 METHOD (the same method inside the file)
      expect([booked!.method, moved!.method, cancelled!.method]).toEqual(['REQUEST', 'REQUEST', 'CANCEL']);
      // Source: RFC 5545 §3.8.4.7 UID (one identifier for every file about the same event)
      expect([booked!.uid, moved!.uid, cancelled!.uid]).toEqual([uid, uid, uid]);
      // Source: RFC 5545 §3.8.7.4 SEQUENCE; RFC 5546 §2.1.4 (it rises with every significant change, a cancel included)
      expect([booked!.sequence, moved!.sequence, cancelled!.sequence]).toEqual([0, 1, 2]);
      // Source: RFC 5545 §3.8.2.4 DTSTART, §3.8.2.2 DTEND (UTC form, §3.3.5)
      expect([booked!.start, booked!.end]).toEqual(['2027-01-05T14:00:00.000Z', '2027-01-05T15:00:00.000Z']);
      expect([moved!.start, moved!.end]).toEqual(['2027-01-06T19:00:00.000Z', '2027-01-06T20:00:00.000Z']);
      expect([cancelled!.start, cancelled!.end]).toEqual(['2027-01-06T19:00:00.000Z', '2027-01-06T20:00:00.000Z']);
      // Source: RFC 5545 §3.8.7.2 DTSTAMP (when the file was made: the server's clock at each change)
      expect([booked!.stamp, moved!.stamp, cancelled!.stamp]).toEqual(['2027-01-04T12:00:00.000Z', '2027-01-04T13:30:00.000Z', '2027-01-04T15:00:00.000Z']);
      // Source: RFC 5545 §3.8.1.11 STATUS; RFC 5546 §3.2.5 (a cancelled event is CANCELLED)
      expect(cancelled!.status).toBe('CANCELLED');
      // Source: RFC 5545 §3.8.1.7 LOCATION (the job's address and postcode)
      expect(booked!.location).toBe('12 Alder Row, 10027');
      // Source: RFC 5545 §3.8.4.3 ORGANIZER (the firm), §3.8.4.1 ATTENDEE (the homeowner and the salesperson)
      expect(booked!.organizer).toBe(`mailto:${firm.company.contactEmail}`);
      expect(booked!.attendees.sort()).toEqual([`mailto:${homeowner}`, `mailto:${salesperson}`].sort());
    }
  });

  test('a mail program gets an .ics file: the calendar part, and an attachment named visit.ics', async () => {
    clock = useFakeClock('2027-01-04T12:00:00Z');
    const firm = await visitFirm(em());
    const lead = await visitLead(em(), firm);
    await bookAsStaff(em(), firm, lead.id, '2027-01-07T15:00:00.000Z'); // Thursday 10:00 EST
    await deliverMailTo(em(), lead.email);
    const [mail] = await mailsFor(lead.email, 1);
    // nodemailer's icalEvent writes the file twice: the text/calendar alternative and this attachment.
    const file = mail!.parts.find((p) => p.filename === 'visit.ics');
    expect(file).toMatchObject({ contentType: 'application/ics', disposition: 'attachment' });
    expect(file!.content).toBe(mail!.parts.find((p) => p.contentType === 'text/calendar')!.content);
  });

  test('the homeowner’s e-mail is in the firm’s name and says the time on the firm’s clock, who comes, where, and the link', async () => {
    clock = useFakeClock('2027-01-04T12:00:00Z');
    const firm = await visitFirm(em());
    const lead = await visitLead(em(), firm, 'Marta Quill');
    const visit = await bookAsStaff(em(), firm, lead.id, '2027-01-05T19:00:00.000Z'); // Tuesday 14:00 EST
    await deliverMailTo(em(), [lead.email, firm.sid.email]);
    const [mail] = await mailsFor(lead.email, 1);
    expect(mail!.from.name).toBe(firm.company.name);
    expect(mail!.replyTo).toBe(firm.company.contactEmail);
    expect(mail!.subject).toBe(`Your site visit with ${firm.company.name}: Tue, Jan 5, 2027, 2:00 PM EST`);
    expect(mail!.text).toContain('Sid from');
    expect(mail!.text).toContain('Tue, Jan 5, 2027, 2:00 PM EST');
    expect(mail!.text).toContain('12 Alder Row, 10027');
    expect(mail!.text).toContain('about an hour');
    expect(mail!.text).toContain('(555) 010-2233');
    expect(mail!.text).toMatch(new RegExp(`/visit/${visit.id}\\.[A-Za-z0-9_-]{43}`));
    const [staffMail] = await mailsFor(firm.sid.email, 1);
    expect(staffMail!.subject).toBe('Site visit booked: Marta Quill, Tue, Jan 5, 2027, 2:00 PM EST');
    expect(staffMail!.text).toContain(`/app/leads/${lead.id}`);
  });

  test('a visit handed to another salesperson: the new one gets the invitation, the old one a CANCEL naming only them', async () => {
    clock = useFakeClock('2027-01-04T12:00:00Z');
    const firm = await visitFirm(em());
    const lead = await visitLead(em(), firm);
    const visit = await bookAsStaff(em(), firm, lead.id, '2027-01-05T14:00:00.000Z');
    await moveVisit(em(), {
      companyId: firm.company.id,
      visitId: visit.id,
      start: new Date('2027-01-05T14:00:00.000Z'),
      salespersonId: firm.ruth.membership.id,
      by: 'staff',
    });
    await deliverMailTo(em(), [firm.sid.email, firm.ruth.email]);
    // One delivery pass sends several at once, so they may arrive in any order.
    const handedOver = (await mailsFor(firm.sid.email, 2)).map(invitationOf).find((i) => i.method === 'CANCEL');
    const [invited] = (await mailsFor(firm.ruth.email, 1)).map(invitationOf);
    // Source: RFC 5546 §3.2.5 (CANCEL sent to the attendees no longer invited), §2.1.4 SEQUENCE
    expect(handedOver).toMatchObject({ method: 'CANCEL', sequence: 1, attendees: [`mailto:${firm.sid.email}`] });
    expect(invited).toMatchObject({ method: 'REQUEST', sequence: 1, uid: visitUid(visit.id) });
    expect(invited!.attendees).toContain(`mailto:${firm.ruth.email}`);
  });

  test('a visit whose salesperson has left the firm: the cancellation goes to the homeowner alone', async () => {
    clock = useFakeClock('2027-01-04T12:00:00Z');
    const firm = await visitFirm(em());
    const lead = await visitLead(em(), firm);
    const visit = await bookAsStaff(em(), firm, lead.id, '2027-01-08T14:00:00.000Z');
    await em().nativeUpdate(Visit, { id: visit.id }, { salesperson: null });
    await cancelVisit(em(), { companyId: firm.company.id, visitId: visit.id, by: 'staff' });
    await deliverMailTo(em(), [lead.email, firm.sid.email]);
    // One delivery pass sends several at once, so they may arrive in any order.
    const mail = (await mailsFor(lead.email, 2)).find((m) => invitationOf(m).method === 'CANCEL')!;
    expect(invitationOf(mail)).toMatchObject({ method: 'CANCEL', attendees: [`mailto:${lead.email}`] });
    expect(mail.text).toContain('is cancelled');
    // Sid had the booking's invitation only.
    expect((await mailsFor(firm.sid.email, 1)).map((m) => invitationOf(m).method)).toEqual(['REQUEST']);
  });
});
