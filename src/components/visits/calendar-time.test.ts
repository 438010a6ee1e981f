import { describe, expect, test } from 'vitest';
import {
  addDays,
  dateHeading,
  initials,
  instantAt,
  layoutLanes,
  localDateAt,
  mondayOf,
  openMinutesOn,
  rangeOfDates,
  snapToStep,
  shortDayTime,
  wallMinutesAt,
  weekDates,
  weekdayOf,
} from './calendar-time';

describe('weeks and dates', () => {
  test('weeks run Monday to Sunday, across a month and a year end', () => {
    // Source: ISO 8601-1:2019 §2.2.8 (a calendar week begins on Monday); 1 January 2027 is a Friday
    // (from memory, checked against the proleptic Gregorian calendar by Date.UTC below).
    expect(weekdayOf('2027-01-01')).toBe('fri');
    expect(mondayOf('2027-01-01')).toBe('2026-12-28');
    expect(mondayOf('2026-12-28')).toBe('2026-12-28');
    expect(mondayOf('2027-01-03')).toBe('2026-12-28');
    expect(weekDates('2026-12-28')).toEqual(['2026-12-28', '2026-12-29', '2026-12-30', '2026-12-31', '2027-01-01', '2027-01-02', '2027-01-03']);
    expect(addDays('2028-02-28', 1)).toBe('2028-02-29'); // 2028 is a leap year. Source: Gregorian rule (divisible by 4, not by 100 unless by 400).
  });

  test('a day heading is the date itself, not shifted by any zone', () => {
    expect(dateHeading('2027-01-04')).toBe('Mon, Jan 4');
  });
});

describe('the firm clock', () => {
  // Source: IANA tz database, America/New_York: EST (UTC−5) until 2027-03-14 02:00, then EDT (UTC−4);
  // Europe/London: GMT until 2027-03-28 01:00, then BST (UTC+1).
  test('a visit is placed by the wall-clock time the firm sees', () => {
    const at = new Date('2027-01-05T14:00:00Z'); // 09:00 EST
    expect(localDateAt(at, 'America/New_York')).toBe('2027-01-05');
    expect(wallMinutesAt(at, 'America/New_York')).toBe(9 * 60);
    expect(wallMinutesAt(at, 'Europe/London')).toBe(14 * 60);
    expect(shortDayTime(at, 'America/New_York')).toBe('Tue 9:00 AM');
    // Late evening in New York is already the next date in London.
    const late = new Date('2027-01-06T02:30:00Z');
    expect([localDateAt(late, 'America/New_York'), localDateAt(late, 'Europe/London')]).toEqual(['2027-01-05', '2027-01-06']);
  });

  test('a dropped time becomes the instant the firm clock shows it, on either side of a clock change', () => {
    expect(instantAt('2027-03-12', 14 * 60, 'America/New_York')?.toISOString()).toBe('2027-03-12T19:00:00.000Z'); // EST
    expect(instantAt('2027-03-15', 14 * 60, 'America/New_York')?.toISOString()).toBe('2027-03-15T18:00:00.000Z'); // EDT
    // The hour skipped on the change day has no instant, so a drop there is refused, never shifted.
    expect(instantAt('2027-03-14', 2 * 60 + 30, 'America/New_York')).toBeNull();
    // Source: IANA tz database, America/New_York: 2027-11-07 02:00 EDT goes back to 01:00 EST; a repeated time is its first showing.
    expect(instantAt('2027-11-07', 60 + 30, 'America/New_York')?.toISOString()).toBe('2027-11-07T05:30:00.000Z');
  });

  test('the week asked for spans local midnights, 167 hours long in the week the clocks go forward', () => {
    const { from, to } = rangeOfDates('2027-03-22', 7, 'Europe/London');
    expect(from.toISOString()).toBe('2027-03-22T00:00:00.000Z');
    expect(to.toISOString()).toBe('2027-03-28T23:00:00.000Z');
    expect((to.getTime() - from.getTime()) / 3_600_000).toBe(167);
  });

  test('a drag snaps to the firm step', () => {
    expect(snapToStep(9 * 60 + 14, 30)).toBe(9 * 60);
    expect(snapToStep(9 * 60 + 16, 30)).toBe(9 * 60 + 30);
    expect(snapToStep(9 * 60 + 8, 15)).toBe(9 * 60 + 15);
  });
});

describe('open hours and lanes', () => {
  const sam = { membershipId: 's', weekly: { mon: [{ from: '09:00', to: '12:00' }], tue: [{ from: '13:00', to: '17:00' }] }, daysOff: ['2027-01-11'] };
  const ruth = { membershipId: 'r', weekly: { mon: [{ from: '11:00', to: '15:00' }] }, daysOff: [] };

  test('the open hours of a day merge everyone who works it, leaving out those with the day off', () => {
    expect(openMinutesOn('2027-01-04', [sam, ruth])).toEqual([{ from: 540, to: 900 }]);
    expect(openMinutesOn('2027-01-11', [sam, ruth])).toEqual([{ from: 660, to: 900 }]);
    expect(openMinutesOn('2027-01-05', [ruth])).toEqual([]);
  });

  test('overlapping visits sit side by side; one that only touches the next keeps the full width', () => {
    const laid = layoutLanes([
      { id: 'a', start: 540, end: 600 },
      { id: 'b', start: 570, end: 630 },
      { id: 'c', start: 630, end: 690 },
    ]);
    expect(laid.map((v) => [v.id, v.lane, v.lanes])).toEqual([
      ['a', 0, 2],
      ['b', 1, 2],
      ['c', 0, 1],
    ]);
  });

  test('initials name whose visit it is', () => {
    expect(initials('Sam Hollis')).toBe('SH');
    expect(initials('Olive Marsh-Dean Ward')).toBe('OW');
    expect(initials('Cher')).toBe('CH');
  });
});
