import { describe, expect, test } from 'vitest';
import { digestDueToday, instantAtLocalTime, localDay, nextDigestAt } from './digest-time';

// Source: IANA tz database (as the runtime's Intl carries it), America/Chicago and Europe/London
// rules: the US changes on the second Sunday of March and the first Sunday of November (Energy
// Policy Act of 2005), the EU on the last Sundays of March and October at 01:00 UTC. So 07:30 in
// Chicago is 13:30 UTC under CST (UTC−6) and 12:30 UTC under CDT (UTC−5); in London 07:30 UTC
// under GMT and 06:30 UTC under BST.
describe('the morning digest time on the firm’s clock', () => {
  test('07:30 in Chicago on both sides of the spring change (2026-03-08)', () => {
    expect(instantAtLocalTime('2026-03-07', 'America/Chicago', 7, 30).toISOString()).toBe('2026-03-07T13:30:00.000Z');
    expect(instantAtLocalTime('2026-03-08', 'America/Chicago', 7, 30).toISOString()).toBe('2026-03-08T12:30:00.000Z');
    // The run after Saturday's digest is Sunday's, 23 hours later.
    expect(nextDigestAt(new Date('2026-03-07T13:30:00Z'), 'America/Chicago').toISOString()).toBe('2026-03-08T12:30:00.000Z');
  });

  test('07:30 in Chicago on both sides of the autumn change (2026-11-01)', () => {
    expect(instantAtLocalTime('2026-10-31', 'America/Chicago', 7, 30).toISOString()).toBe('2026-10-31T12:30:00.000Z');
    expect(nextDigestAt(new Date('2026-10-31T12:30:00Z'), 'America/Chicago').toISOString()).toBe('2026-11-01T13:30:00.000Z');
  });

  test('London changes on other days (2026-03-29, 2026-10-25)', () => {
    expect(nextDigestAt(new Date('2026-03-28T08:00:00Z'), 'Europe/London').toISOString()).toBe('2026-03-29T06:30:00.000Z');
    expect(nextDigestAt(new Date('2026-10-24T08:00:00Z'), 'Europe/London').toISOString()).toBe('2026-10-25T07:30:00.000Z');
  });

  test('a wall time skipped or shown twice by a change is read as RFC 5545 reads it', () => {
    // Source: RFC 5545 §3.3.5: a local time that does not occur "is interpreted using the UTC offset
    // before the gap", one that occurs twice "refers to the first occurrence".
    // 02:30 does not exist in Chicago on 2026-03-08: read with CST's offset it is 08:30 UTC (03:30 CDT).
    expect(instantAtLocalTime('2026-03-08', 'America/Chicago', 2, 30).toISOString()).toBe('2026-03-08T08:30:00.000Z');
    // 01:30 happens twice on 2026-11-01: first under CDT (06:30 UTC), then under CST.
    expect(instantAtLocalTime('2026-11-01', 'America/Chicago', 1, 30).toISOString()).toBe('2026-11-01T06:30:00.000Z');
  });

  test('the firm’s day, not the server’s, decides whether today’s digest is due', () => {
    // 05:00 UTC on Dec 4 is still Dec 3, 23:00 in Chicago: that day's digest is long due.
    expect(localDay(new Date('2026-12-04T05:00:00Z'), 'America/Chicago')).toBe('2026-12-03');
    expect(digestDueToday(new Date('2026-12-04T05:00:00Z'), 'America/Chicago')).toEqual({ due: true, day: '2026-12-03' });
    // 13:29 UTC on Dec 4 is 07:29 CST: not yet.
    expect(digestDueToday(new Date('2026-12-04T13:29:00Z'), 'America/Chicago')).toEqual({ due: false, day: '2026-12-04' });
    expect(digestDueToday(new Date('2026-12-04T13:30:00Z'), 'America/Chicago')).toEqual({ due: true, day: '2026-12-04' });
  });
});
