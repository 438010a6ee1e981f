/**
 * The calendar file (RFC 5545, iTIP methods of RFC 5546) sent with a visit's e-mails: REQUEST when a
 * visit is booked or moved, CANCEL when it is called off. Times are written in UTC, which RFC 5545
 * §3.3.5 allows ("form #2"), so no time zone definitions are needed. Pure: the caller passes `stamp`.
 */
import { createEvent, type EventAttributes } from 'ics';

export type InvitationPerson = { name: string; email: string };

export type VisitCalendarInput = {
  /** REQUEST: a booking or a change to it. CANCEL: the visit is called off. */
  method: 'REQUEST' | 'CANCEL';
  /** The same for every file about one visit. */
  uid: string;
  /** 0 when booked; one more for every change, a cancel included (RFC 5546 §2.1.4, §3.2.5). */
  sequence: number;
  start: Date;
  end: Date;
  /** When this file was made (DTSTAMP). */
  stamp: Date;
  title: string;
  description: string;
  location: string;
  organizer: InvitationPerson;
  attendees: InvitationPerson[];
};

export class InvitationInputError extends Error {
  override name = 'InvitationInputError';
}

const PRODUCT_ID = '-//Lapwing//Visits//EN';
/** RFC 5545 §3.1: lines SHOULD NOT be longer than 75 octets, excluding the line break. */
const MAX_LINE_OCTETS = 75;

/** The .ics text (CRLF line breaks) for one visit. */
export function visitCalendarFile(input: VisitCalendarInput): string {
  check(input);
  const utc = { startInputType: 'utc', startOutputType: 'utc', endInputType: 'utc', endOutputType: 'utc' } as const;
  const event: EventAttributes & { timestamp: number } = {
    ...utc,
    productId: PRODUCT_ID,
    method: input.method,
    uid: input.uid,
    sequence: input.sequence,
    // DTSTAMP: `timestamp` is read by ics (its default is the machine's clock) though its types omit it.
    timestamp: input.stamp.getTime(),
    start: input.start.getTime(),
    end: input.end.getTime(),
    title: input.title,
    description: input.description,
    location: input.location,
    // RFC 5546 §3.2.2 (REQUEST: TENTATIVE or CONFIRMED) and §3.2.5 (CANCEL of a whole event: CANCELLED).
    status: input.method === 'CANCEL' ? 'CANCELLED' : 'CONFIRMED',
    organizer: { name: paramText(input.organizer.name), email: input.organizer.email },
    attendees: input.attendees.map((person) => ({
      name: paramText(person.name),
      email: person.email,
      role: 'REQ-PARTICIPANT',
      ...(input.method === 'REQUEST' ? { rsvp: true, partstat: 'NEEDS-ACTION' as const } : {}),
    })),
  };
  const { error, value } = createEvent(event);
  if (error || !value) throw new InvitationInputError(`The calendar file could not be written: ${error?.message ?? 'no output'}`);
  return refoldByOctets(value);
}

function check(input: VisitCalendarInput) {
  const faults: string[] = [];
  if (input.method !== 'REQUEST' && input.method !== 'CANCEL') faults.push('method must be REQUEST or CANCEL');
  if (!input.uid.trim()) faults.push('uid is empty');
  if (!Number.isInteger(input.sequence) || input.sequence < 0) faults.push('sequence must be a whole number, 0 or more');
  for (const key of ['start', 'end', 'stamp'] as const)
    if (!(input[key] instanceof Date) || !Number.isFinite(input[key].getTime())) faults.push(`${key} is not a valid date`);
  if (input.end.getTime() <= input.start.getTime()) faults.push('end must be after start');
  if (input.attendees.length === 0) faults.push('attendees: at least one (RFC 5546 §3.2.2, §3.2.5)');
  if (faults.length) throw new InvitationInputError(faults.join('; '));
}

/**
 * A name as a parameter value (CN). RFC 5545 §3.2 allows no DQUOTE inside one, and ics writes `\"`,
 * which no reader undoes; RFC 6868 §3 is the standard escape (`^'` for DQUOTE, `^n` for a line
 * break, `^^` for a caret), which ics leaves alone.
 */
function paramText(name: string): string {
  return name
    .replaceAll('^', '^^')
    .replaceAll('"', "^'")
    .replace(/\r\n|\r|\n/g, '^n');
}

/**
 * ics folds lines at 75 characters, not 75 octets, so a line with non-ASCII text can run past the
 * limit of RFC 5545 §3.1. Unfold its output and fold again by octets, never inside a UTF-8
 * sequence; a continuation line starts with one space.
 */
function refoldByOctets(text: string): string {
  const lines = text.replace(/\r\n[ \t]/g, '').split('\r\n');
  const encoder = new TextEncoder();
  const folded = lines.map((line) => {
    const parts: string[] = [];
    let current = '';
    let octets = 0;
    for (const char of line) {
      const size = encoder.encode(char).length;
      // The first line may hold 75 octets; a continuation line 74 after its leading space.
      const limit = parts.length === 0 ? MAX_LINE_OCTETS : MAX_LINE_OCTETS - 1;
      if (octets + size > limit) {
        parts.push(current);
        current = '';
        octets = 0;
      }
      current += char;
      octets += size;
    }
    parts.push(current);
    return parts.join('\r\n ');
  });
  return folded.join('\r\n');
}
