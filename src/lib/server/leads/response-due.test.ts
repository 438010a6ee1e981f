import { describe, expect, test } from 'vitest';
import { responseDueAt, workingMinutesBetween } from './response-due';

// Source: the IANA time zone database (tzdata) as the runtime's Intl API applies it, through
// @date-fns/tz. Rules used below: the US changes to daylight time on the second Sunday of March
// (2026-03-08) and back on the first Sunday of November; the EU changes back on the last Sunday of
// October (2026-10-25). Chicago is UTC−6 in winter and UTC−5 in summer; London UTC+0 / UTC+1.
// Working time is the default, Monday–Friday 08:00–17:00 local (common practice, no source), and
// the target 4 working hours (the default).

const due = (iso: string, zone: string, minutes?: number) => responseDueAt(new Date(iso), zone, minutes).toISOString();

describe('responseDueAt', () => {
  test('inside working hours: four hours later the same day', () => {
    // Tue 2026-03-03 10:00 CST → 14:00 CST = 20:00Z.
    expect(due('2026-03-03T16:00:00Z', 'America/Chicago')).toBe('2026-03-03T20:00:00.000Z');
  });

  test('late in the day: the rest carries over to the next morning', () => {
    // Tue 15:00 CST: two hours on Tuesday, two from Wednesday 08:00 → Wed 10:00 CST = 16:00Z.
    expect(due('2026-03-03T21:00:00Z', 'America/Chicago')).toBe('2026-03-04T16:00:00.000Z');
  });

  test('before opening: counted from the start of the day', () => {
    // Wed 06:00 CST → 12:00 CST = 18:00Z.
    expect(due('2026-03-04T12:00:00Z', 'America/Chicago')).toBe('2026-03-04T18:00:00.000Z');
  });

  test('Friday afternoon over a weekend that starts daylight time: Monday morning on the new offset', () => {
    // Fri 2026-03-06 15:00 CST: two hours Friday; Monday 2026-03-09 is CDT (UTC−5): 08:00 + 2 h = 10:00 CDT = 15:00Z.
    expect(due('2026-03-06T21:00:00Z', 'America/Chicago')).toBe('2026-03-09T15:00:00.000Z');
  });

  test('on a Saturday: nothing counts until Monday', () => {
    // Sat 2026-03-14 11:00 CDT → Mon 2026-03-16 12:00 CDT = 17:00Z.
    expect(due('2026-03-14T16:00:00Z', 'America/Chicago')).toBe('2026-03-16T17:00:00.000Z');
  });

  test('after closing on Friday when summer time ends over the weekend (London)', () => {
    // Fri 2026-10-23 16:00 BST (UTC+1): one hour Friday; Monday 2026-10-26 is GMT: 08:00 + 3 h = 11:00Z.
    expect(due('2026-10-23T15:00:00Z', 'Europe/London')).toBe('2026-10-26T11:00:00.000Z');
  });

  test('a target longer than one working day spans days', () => {
    // Mon 2026-03-02 08:00 CST + 12 working hours: nine on Monday, three on Tuesday → Tue 11:00 CST = 17:00Z.
    expect(due('2026-03-02T14:00:00Z', 'America/Chicago', 12 * 60)).toBe('2026-03-03T17:00:00.000Z');
  });

  test('a zone east of UTC: the local weekday decides, not the UTC one', () => {
    // Sydney, Mon 2026-06-01 07:30 AEST (UTC+10) is still Sunday in UTC; due 12:00 AEST Monday = 02:00Z.
    expect(due('2026-05-31T21:30:00Z', 'Australia/Sydney')).toBe('2026-06-01T02:00:00.000Z');
  });
});

describe('workingMinutesBetween', () => {
  const between = (from: string, to: string, zone = 'America/Chicago') => workingMinutesBetween(new Date(from), new Date(to), zone);

  test('inside one working day: the plain difference', () => {
    // Tue 2026-03-03 10:00 → 12:30 CST.
    expect(between('2026-03-03T16:00:00Z', '2026-03-03T18:30:00Z')).toBe(150);
  });

  test('evenings, nights and weekends do not count', () => {
    // Fri 2026-02-27 16:00 CST → Mon 2026-03-02 09:00 CST: 60 min Friday, 60 min Monday.
    expect(between('2026-02-27T22:00:00Z', '2026-03-02T15:00:00Z')).toBe(120);
    // Sat 10:00 → Sun 15:00: none.
    expect(between('2026-02-28T16:00:00Z', '2026-03-01T21:00:00Z')).toBe(0);
  });

  test('over the change to daylight time the working day is still nine hours', () => {
    // Fri 2026-03-06 08:00 CST → Mon 2026-03-09 17:00 CDT: two full working days.
    expect(between('2026-03-06T14:00:00Z', '2026-03-09T22:00:00Z')).toBe(18 * 60);
  });

  test('the inverse of responseDueAt: an answer at the due time took the target', () => {
    for (const received of ['2026-03-06T21:00:00Z', '2026-10-23T15:00:00Z', '2026-03-14T16:00:00Z']) {
      for (const minutes of [30, 240, 600]) {
        const at = new Date(received);
        expect(workingMinutesBetween(at, responseDueAt(at, 'Europe/London', minutes), 'Europe/London')).toBeCloseTo(minutes, 6);
      }
    }
  });

  test('no time, or time backwards, is zero', () => {
    expect(between('2026-03-03T16:00:00Z', '2026-03-03T16:00:00Z')).toBe(0);
    expect(between('2026-03-03T18:00:00Z', '2026-03-03T16:00:00Z')).toBe(0);
  });
});
