import { describe, expect, test } from 'vitest';
import { reminderDueAt } from './index.ts';

// Source: IANA tz database (US: second Sunday of March / first Sunday of November at 02:00 local; EU: last Sunday of March / October at 01:00 UTC); docs/sources.md §70
// So 2026-03-08 in New York is under EDT (UTC−4) from 03:00 on, and 2026-10-25 in London is under
// GMT (UTC+0) from 01:00 UTC on. Expected instants are written in UTC from those offsets.
const at = (iso: string) => new Date(iso);

describe('the reminder the day before a visit, at 09:00 on the firm’s clock', () => {
  test('New York: the day before a visit on 2026-03-09 is the change day, so 09:00 is EDT (13:00 UTC)', () => {
    // The visit: Monday 2026-03-09, 10:00 EDT.
    const due = reminderDueAt(at('2026-03-09T14:00:00Z'), 'America/New_York', at('2026-03-01T12:00:00Z'));
    expect(due.toISOString()).toBe('2026-03-08T13:00:00.000Z');
  });

  test('New York: the Saturday before the change is still EST (14:00 UTC)', () => {
    const due = reminderDueAt(at('2026-03-08T17:00:00Z'), 'America/New_York', at('2026-03-01T12:00:00Z'));
    expect(due.toISOString()).toBe('2026-03-07T14:00:00.000Z');
  });

  test('London: 09:00 on 2026-10-25, the change day, is GMT (09:00 UTC), not BST', () => {
    // The visit: Monday 2026-10-26, 08:00 GMT.
    const due = reminderDueAt(at('2026-10-26T08:00:00Z'), 'Europe/London', at('2026-10-20T12:00:00Z'));
    expect(due.toISOString()).toBe('2026-10-25T09:00:00.000Z');
  });

  test('the visit’s day is its local date, not the UTC one', () => {
    // 2026-06-11T03:30Z is 23:30 EDT on 2026-06-10 in New York: the day before is June 9.
    const due = reminderDueAt(at('2026-06-11T03:30:00Z'), 'America/New_York', at('2026-06-01T12:00:00Z'));
    expect(due.toISOString()).toBe('2026-06-09T13:00:00.000Z');
  });
});

describe('at once', () => {
  const visit = at('2026-03-09T14:00:00Z');
  const nineTheDayBefore = '2026-03-08T13:00:00.000Z';

  test('booked after 09:00 the day before: the reminder is due when booked', () => {
    expect(reminderDueAt(visit, 'America/New_York', at('2026-03-08T15:20:00Z')).toISOString()).toBe('2026-03-08T15:20:00.000Z');
  });

  test('booked on the visit’s own day: due when booked', () => {
    expect(reminderDueAt(visit, 'America/New_York', at('2026-03-09T12:00:00Z')).toISOString()).toBe('2026-03-09T12:00:00.000Z');
  });

  test('booked exactly at that 09:00 it is not after the booking, so at once; a millisecond earlier it waits', () => {
    expect(reminderDueAt(visit, 'America/New_York', at(nineTheDayBefore)).toISOString()).toBe(nineTheDayBefore);
    expect(reminderDueAt(visit, 'America/New_York', at('2026-03-08T12:59:59.999Z')).toISOString()).toBe(nineTheDayBefore);
  });
});

describe('input it refuses', () => {
  test('an unknown zone or an invalid date', () => {
    expect(() => reminderDueAt(at('2026-03-09T14:00:00Z'), 'Nowhere/Town', at('2026-03-01T00:00:00Z'))).toThrow(RangeError);
    expect(() => reminderDueAt(at('not a date'), 'Europe/London', at('2026-03-01T00:00:00Z'))).toThrow(RangeError);
    expect(() => reminderDueAt(at('2026-03-09T14:00:00Z'), 'Europe/London', at('bad'))).toThrow(RangeError);
  });
});
