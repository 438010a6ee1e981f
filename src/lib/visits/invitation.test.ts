import ICAL from 'ical.js';
import { describe, expect, test } from 'vitest';
import { InvitationInputError, visitCalendarFile, type VisitCalendarInput } from './index.ts';

// Sources of the checks: RFC 5545, RFC 5546 and RFC 6868 as cited beside each (docs/sources.md §70).
// Demo data: an invented firm and homeowner.
const booking: VisitCalendarInput = {
  method: 'REQUEST',
  uid: 'visit-7f3k2@lapwing.test',
  sequence: 0,
  start: new Date('2026-03-09T14:00:00Z'),
  end: new Date('2026-03-09T15:00:00Z'),
  stamp: new Date('2026-03-02T16:45:12Z'),
  title: 'Site visit: hallway wainscot',
  description: 'Measuring the hallway for wainscot and baseboard.',
  location: '12 Alder Row, Millbrook',
  organizer: { name: 'Birch & Bevel Carpentry', email: 'desk@birch-bevel.test' },
  attendees: [{ name: 'Robin Hale', email: 'robin.hale@example.test' }],
};

/** The file read back by an independent parser (ical.js): its calendar and its one event. */
function read(text: string) {
  const calendar = new ICAL.Component(ICAL.parse(text));
  const events = calendar.getAllSubcomponents('vevent');
  expect(events).toHaveLength(1);
  return { calendar, event: events[0]! };
}

const utcText = (value: unknown) => (value as ICAL.Time).toString();

describe('a booked visit (REQUEST)', () => {
  const { calendar, event } = read(visitCalendarFile(booking));

  test('says what the file asks for and that the visit is confirmed', () => {
    // Source: RFC 5545 §3.7.2 METHOD; RFC 5546 §3.2.2 REQUEST
    expect(calendar.getFirstPropertyValue('method')).toBe('REQUEST');
    // Source: RFC 5545 §3.8.1.11 STATUS; RFC 5546 §3.2.2 (TENTATIVE or CONFIRMED for a REQUEST)
    expect(event.getFirstPropertyValue('status')).toBe('CONFIRMED');
  });

  test('carries the visit’s identity, version and the time the file was made', () => {
    // Source: RFC 5545 §3.8.4.7 UID
    expect(event.getFirstPropertyValue('uid')).toBe('visit-7f3k2@lapwing.test');
    // Source: RFC 5545 §3.8.7.4 SEQUENCE
    expect(event.getFirstPropertyValue('sequence')).toBe(0);
    // Source: RFC 5545 §3.8.7.2 DTSTAMP (a UTC date-time)
    expect(utcText(event.getFirstPropertyValue('dtstamp'))).toBe('2026-03-02T16:45:12Z');
  });

  test('has the start and end in UTC', () => {
    // Source: RFC 5545 §3.8.2.4 DTSTART; §3.3.5 form #2, UTC time
    expect(utcText(event.getFirstPropertyValue('dtstart'))).toBe('2026-03-09T14:00:00Z');
    // Source: RFC 5545 §3.8.2.2 DTEND
    expect(utcText(event.getFirstPropertyValue('dtend'))).toBe('2026-03-09T15:00:00Z');
    expect((event.getFirstPropertyValue('dtstart') as ICAL.Time).toJSDate().toISOString()).toBe('2026-03-09T14:00:00.000Z');
  });

  test('names the firm as organizer, the homeowner as attendee, and the place', () => {
    // Source: RFC 5545 §3.8.4.3 ORGANIZER (a cal-address, with CN)
    const organizer = event.getFirstProperty('organizer')!;
    expect(String(organizer.getFirstValue()).toLowerCase()).toBe('mailto:desk@birch-bevel.test');
    expect(organizer.getParameter('cn')).toBe('Birch & Bevel Carpentry');
    // Source: RFC 5545 §3.8.4.1 ATTENDEE; RFC 5546 §3.2.2 (a REQUEST names its attendees)
    const attendee = event.getFirstProperty('attendee')!;
    expect(String(attendee.getFirstValue()).toLowerCase()).toBe('mailto:robin.hale@example.test');
    expect(attendee.getParameter('cn')).toBe('Robin Hale');
    expect(attendee.getParameter('partstat')).toBe('NEEDS-ACTION');
    // Source: RFC 5545 §3.8.1.7 LOCATION
    expect(event.getFirstPropertyValue('location')).toBe('12 Alder Row, Millbrook');
    // Source: RFC 5545 §3.8.1.12 SUMMARY, §3.8.1.5 DESCRIPTION
    expect(event.getFirstPropertyValue('summary')).toBe('Site visit: hallway wainscot');
    expect(event.getFirstPropertyValue('description')).toBe('Measuring the hallway for wainscot and baseboard.');
  });
});

describe('a moved visit and a cancelled one', () => {
  const moved = {
    ...booking,
    sequence: 1,
    start: new Date('2026-03-11T18:30:00Z'),
    end: new Date('2026-03-11T19:30:00Z'),
    stamp: new Date('2026-03-04T09:00:00Z'),
  };
  const cancelled = { ...moved, method: 'CANCEL' as const, sequence: 2, stamp: new Date('2026-03-05T10:15:00Z') };

  test('a reschedule is a REQUEST with the same UID, SEQUENCE one higher and the new times', () => {
    const { calendar, event } = read(visitCalendarFile(moved));
    // Source: RFC 5546 §3.2.2 REQUEST (a rescheduled event is a new REQUEST with a higher SEQUENCE); RFC 5545 §3.7.2 METHOD
    expect(calendar.getFirstPropertyValue('method')).toBe('REQUEST');
    // Source: RFC 5545 §3.8.4.7 UID (the same event)
    expect(event.getFirstPropertyValue('uid')).toBe(booking.uid);
    // Source: RFC 5545 §3.8.7.4 SEQUENCE (incremented when the start or end changes)
    expect(event.getFirstPropertyValue('sequence')).toBe(1);
    // Source: RFC 5545 §3.8.2.4 DTSTART, §3.8.2.2 DTEND
    expect(utcText(event.getFirstPropertyValue('dtstart'))).toBe('2026-03-11T18:30:00Z');
    expect(utcText(event.getFirstPropertyValue('dtend'))).toBe('2026-03-11T19:30:00Z');
    // Source: RFC 5545 §3.8.7.2 DTSTAMP
    expect(utcText(event.getFirstPropertyValue('dtstamp'))).toBe('2026-03-04T09:00:00Z');
  });

  test('a cancel carries METHOD:CANCEL, STATUS:CANCELLED, the same UID and a higher SEQUENCE', () => {
    const { calendar, event } = read(visitCalendarFile(cancelled));
    // Source: RFC 5546 §3.2.5 CANCEL; RFC 5545 §3.7.2 METHOD
    expect(calendar.getFirstPropertyValue('method')).toBe('CANCEL');
    // Source: RFC 5545 §3.8.1.11 STATUS; RFC 5546 §3.2.5 (a cancelled event has STATUS:CANCELLED)
    expect(event.getFirstPropertyValue('status')).toBe('CANCELLED');
    // Source: RFC 5545 §3.8.4.7 UID
    expect(event.getFirstPropertyValue('uid')).toBe(booking.uid);
    // Source: RFC 5545 §3.8.7.4 SEQUENCE; RFC 5546 §3.2.5 (higher than the last REQUEST)
    expect(event.getFirstPropertyValue('sequence')).toBe(2);
    // Source: RFC 5545 §3.8.4.3 ORGANIZER; RFC 5546 §3.2.5 (ORGANIZER, ATTENDEE and DTSTAMP required)
    expect(String(event.getFirstPropertyValue('organizer')).toLowerCase()).toBe('mailto:desk@birch-bevel.test');
    expect(event.getAllProperties('attendee')).toHaveLength(1);
    expect(utcText(event.getFirstPropertyValue('dtstamp'))).toBe('2026-03-05T10:15:00Z');
    // Source: RFC 5545 §3.8.1.7 LOCATION
    expect(event.getFirstPropertyValue('location')).toBe('12 Alder Row, Millbrook');
  });
});

describe('the file as text', () => {
  const long = {
    ...booking,
    description:
      'Measure every wall of the hallway and the stair for wainscot; note outlets, switches and the radiator. '.repeat(5) +
      'Ask about the “old” panelling, too.',
    location: 'Große Straße 7, Hinterhaus — Dachgeschoß, Zürich-Höngg, Schweiz (Klingel: Müller-Lüdenscheidt)',
    attendees: [{ name: 'Zoë Müller-Lüdenscheidt "Zo"', email: 'zoe.mueller@beispiel.test' }],
  };
  const text = visitCalendarFile(long);

  test('every line ends in CRLF', () => {
    // Source: RFC 5545 §3.1 (content lines are delimited by a CRLF sequence)
    expect(text.endsWith('\r\n')).toBe(true);
    expect(text.replaceAll('\r\n', '')).not.toMatch(/[\r\n]/);
  });

  test('no line is longer than 75 octets, even with non-ASCII text', () => {
    // Source: RFC 5545 §3.1 (lines SHOULD NOT be longer than 75 octets, excluding the line break)
    const lines = text.split('\r\n');
    for (const line of lines) expect(Buffer.byteLength(line, 'utf8')).toBeLessThanOrEqual(75);
    // A fold never splits a UTF-8 sequence: each line is valid UTF-8 on its own.
    for (const line of lines) expect(Buffer.from(Buffer.from(line, 'utf8').toString('utf8'), 'utf8').equals(Buffer.from(line, 'utf8'))).toBe(true);
    expect(lines.some((line) => line.startsWith(' '))).toBe(true);
  });

  test('folded text reads back whole, with the non-ASCII address and a quoted name', () => {
    const { event } = read(text);
    // Source: RFC 5545 §3.1 (unfolding), §3.3.11 TEXT escaping, §3.8.1.7 LOCATION, §3.8.1.5 DESCRIPTION
    expect(event.getFirstPropertyValue('location')).toBe(long.location);
    expect(event.getFirstPropertyValue('description')).toBe(long.description);
    // Source: RFC 6868 §3 (^' stands for a DQUOTE in a parameter value), RFC 5545 §3.2.2 CN
    expect(event.getFirstProperty('attendee')!.getParameter('cn')).toBe('Zoë Müller-Lüdenscheidt "Zo"');
  });

  test('a quote in a name never appears inside the quoted parameter value', () => {
    // Source: RFC 5545 §3.1 (quoted-string = DQUOTE *QSAFE-CHAR DQUOTE; QSAFE-CHAR is any character but a control or DQUOTE); RFC 6868 §3
    const unfolded = text.replace(/\r\n[ \t]/g, '');
    expect(unfolded).toContain(`CN="Zoë Müller-Lüdenscheidt ^'Zo^'"`);
    expect(unfolded).not.toContain('\\"');
  });
});

describe('input it refuses', () => {
  test.each([
    ['an end before the start', { end: new Date('2026-03-09T13:00:00Z') }],
    ['an invalid stamp', { stamp: new Date('nope') }],
    ['a negative sequence', { sequence: -1 }],
    ['an empty uid', { uid: ' ' }],
    ['no attendees', { attendees: [] }],
  ])('%s', (_what, change) => {
    expect(() => visitCalendarFile({ ...booking, ...change })).toThrow(InvitationInputError);
  });
});
