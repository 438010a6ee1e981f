import { describe, expect, test } from 'vitest';
import { dayInZone, formatInZone, isTimeZone, isoInZone, zoneAbbreviation, zoneOrUtc } from './time';

const CHICAGO = 'America/Chicago';

describe('a moment written in the firm’s zone', () => {
  test('an inquiry sent at 01:19 UTC on Dec 2 arrived on the evening of Dec 1 in Chicago', () => {
    // Source: IANA tz database, northamerica: America/Chicago is -6:00 (CST) outside US daylight time.
    const at = '2026-12-02T01:19:00Z';
    expect(formatInZone(at, CHICAGO, 'day')).toBe('Dec 1');
    expect(formatInZone(at, CHICAGO, 'date')).toBe('Dec 1, 2026');
    expect(formatInZone(at, CHICAGO, 'dateTime')).toBe('Dec 1, 2026, 7:19 PM');
    expect(formatInZone(at, CHICAGO, 'dateTimeZone')).toBe('Tue, Dec 1, 2026, 7:19 PM CST');
    expect(isoInZone(at, CHICAGO)).toBe('2026-12-01T19:19:00-06:00');
    // Source: IANA tz database, northamerica: America/New_York is -5:00 (EST) in winter.
    expect(formatInZone(at, 'America/New_York', 'dateTimeZone')).toBe('Tue, Dec 1, 2026, 8:19 PM EST');
    expect(formatInZone(at, 'UTC', 'dateTimeZone')).toBe('Wed, Dec 2, 2026, 1:19 AM UTC');
  });

  test('takes Dates, ISO strings and epoch milliseconds alike, and refuses what is not a moment', () => {
    const at = new Date('2026-12-02T01:19:00Z');
    expect(formatInZone(at.getTime(), CHICAGO, 'dateTime')).toBe(formatInZone(at, CHICAGO, 'dateTime'));
    expect(formatInZone(at.toISOString(), CHICAGO, 'dateTime')).toBe(formatInZone(at, CHICAGO, 'dateTime'));
    expect(() => formatInZone('yesterday', CHICAGO)).toThrow(RangeError);
  });

  test('the calendar day turns at local midnight, not at midnight UTC', () => {
    // Source: IANA tz database, northamerica: CST is UTC-6, so local midnight is 06:00 UTC.
    expect(dayInZone('2026-12-02T05:59:00Z', CHICAGO)).toBe('2026-12-01');
    expect(dayInZone('2026-12-02T06:00:00Z', CHICAGO)).toBe('2026-12-02');
  });
});

describe('daylight saving time', () => {
  test('spring forward: Chicago goes from 1:59 AM CST to 3:00 AM CDT on 2026-03-08, and 2 AM never shows', () => {
    // Source: IANA tz database, northamerica: Rule US 2007 max Mar Sun>=8 2:00 (2026-03-08 02:00 local = 08:00 UTC).
    expect(formatInZone('2026-03-08T07:59:00Z', CHICAGO, 'dateTimeZone')).toBe('Sun, Mar 8, 2026, 1:59 AM CST');
    expect(formatInZone('2026-03-08T08:00:00Z', CHICAGO, 'dateTimeZone')).toBe('Sun, Mar 8, 2026, 3:00 AM CDT');
    expect(isoInZone('2026-03-08T08:00:00Z', CHICAGO)).toBe('2026-03-08T03:00:00-05:00');
    const start = Date.parse('2026-03-08T06:00:00Z');
    const hours = new Set<string>();
    for (let minute = 0; minute < 4 * 60; minute++)
      hours.add(formatInZone(start + minute * 60_000, CHICAGO, 'dateTime').replace(/^.*, (\d+):\d\d (AM|PM)$/, '$1 $2'));
    expect([...hours]).toEqual(['12 AM', '1 AM', '3 AM', '4 AM']);
  });

  test('fall back: 1:30 AM happens twice in Chicago on 2026-11-01, first CDT then CST', () => {
    // Source: IANA tz database, northamerica: Rule US 2007 max Nov Sun>=1 2:00 (2026-11-01 02:00 CDT = 07:00 UTC).
    const first = '2026-11-01T06:30:00Z';
    const second = '2026-11-01T07:30:00Z';
    expect(formatInZone(first, CHICAGO, 'dateTime')).toBe('Nov 1, 2026, 1:30 AM');
    expect(formatInZone(second, CHICAGO, 'dateTime')).toBe('Nov 1, 2026, 1:30 AM');
    // Only the zone's name tells the two apart, which is why e-mails carry it.
    expect(formatInZone(first, CHICAGO, 'dateTimeZone')).toBe('Sun, Nov 1, 2026, 1:30 AM CDT');
    expect(formatInZone(second, CHICAGO, 'dateTimeZone')).toBe('Sun, Nov 1, 2026, 1:30 AM CST');
    expect(isoInZone(first, CHICAGO)).toBe('2026-11-01T01:30:00-05:00');
    expect(isoInZone(second, CHICAGO)).toBe('2026-11-01T01:30:00-06:00');
  });

  test('London changes at 01:00 UTC on the last Sundays of March and October 2026', () => {
    // Source: IANA tz database, europe: Rule EU 1981 max Mar lastSun 1:00u and Rule EU 1996 max Oct lastSun 1:00u.
    expect(isoInZone('2026-03-29T00:59:00Z', 'Europe/London')).toBe('2026-03-29T00:59:00Z');
    expect(isoInZone('2026-03-29T01:00:00Z', 'Europe/London')).toBe('2026-03-29T02:00:00+01:00');
    expect(isoInZone('2026-10-25T00:59:00Z', 'Europe/London')).toBe('2026-10-25T01:59:00+01:00');
    expect(isoInZone('2026-10-25T01:00:00Z', 'Europe/London')).toBe('2026-10-25T01:00:00Z');
    // English (US) has no short name for British Summer Time; the offset is written instead.
    expect(zoneAbbreviation('2026-07-01T12:00:00Z', 'Europe/London')).toBe('GMT+1');
    expect(zoneAbbreviation('2026-12-01T12:00:00Z', 'Europe/London')).toBe('GMT');
  });

  test('Sydney runs the other way round: daylight time ends on 2026-04-05 and starts on 2026-10-04', () => {
    // Source: IANA tz database, australasia: Rule AN 2008 max Apr Sun>=1 2:00s and Oct Sun>=1 2:00s (standard time).
    expect(isoInZone('2026-04-04T15:59:00Z', 'Australia/Sydney')).toBe('2026-04-05T02:59:00+11:00');
    expect(isoInZone('2026-04-04T16:00:00Z', 'Australia/Sydney')).toBe('2026-04-05T02:00:00+10:00');
    expect(isoInZone('2026-10-03T15:59:00Z', 'Australia/Sydney')).toBe('2026-10-04T01:59:00+10:00');
    expect(isoInZone('2026-10-03T16:00:00Z', 'Australia/Sydney')).toBe('2026-10-04T03:00:00+11:00');
  });

  test('zones without daylight time or with part-hour offsets', () => {
    // Source: IANA tz database, northamerica: America/Phoenix stays on MST (-7:00) all year.
    expect(formatInZone('2026-07-01T19:00:00Z', 'America/Phoenix', 'dateTimeZone')).toBe('Wed, Jul 1, 2026, 12:00 PM MST');
    // Source: IANA tz database, asia: Asia/Kolkata is +5:30 and Asia/Kathmandu +5:45.
    expect(formatInZone('2026-12-02T01:19:00Z', 'Asia/Kolkata', 'dateTime')).toBe('Dec 2, 2026, 6:49 AM');
    expect(isoInZone('2026-12-02T01:19:00Z', 'Asia/Kathmandu')).toBe('2026-12-02T07:04:00+05:45');
  });
});

describe('zone names', () => {
  test('IANA names and UTC are known; anything else falls back to UTC, labelled as UTC', () => {
    expect(isTimeZone(CHICAGO)).toBe(true);
    expect(isTimeZone('UTC')).toBe(true);
    expect(isTimeZone('Mars/Olympus_Mons')).toBe(false);
    expect(isTimeZone('')).toBe(false);
    expect(zoneOrUtc('Mars/Olympus_Mons')).toBe('UTC');
    expect(formatInZone('2026-12-02T01:19:00Z', 'Mars/Olympus_Mons', 'dateTimeZone')).toBe('Wed, Dec 2, 2026, 1:19 AM UTC');
  });
});
