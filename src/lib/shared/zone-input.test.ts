import { describe, expect, test } from 'vitest';
import { instantToLocalInput, localInputToInstant } from './zone-input';

describe('a date and time typed on the firm’s clock', () => {
  test('is read in the firm’s zone, standard and summer time alike', () => {
    // Source: US Central Time is UTC−6 in winter (CST) and UTC−5 in summer (CDT); from memory.
    expect(localInputToInstant('2026-12-04T09:30', 'America/Chicago')?.toISOString()).toBe('2026-12-04T15:30:00.000Z');
    expect(localInputToInstant('2026-07-04T09:30', 'America/Chicago')?.toISOString()).toBe('2026-07-04T14:30:00.000Z');
    expect(instantToLocalInput('2026-12-04T15:30:00.000Z', 'America/Chicago')).toBe('2026-12-04T09:30');
  });

  test('the hour skipped when summer time starts is refused, the repeated hour is read as one of its two moments', () => {
    // Source: Energy Policy Act of 2005 §110 (15 U.S.C. 260a): summer time starts at 2:00 a.m. on the
    // second Sunday of March and ends at 2:00 a.m. on the first Sunday of November (Mar 8 and Nov 1 in 2026).
    expect(localInputToInstant('2026-03-08T02:30', 'America/Chicago')).toBeNull();
    expect(localInputToInstant('2026-03-08T03:30', 'America/Chicago')?.toISOString()).toBe('2026-03-08T08:30:00.000Z');
    expect(['2026-11-01T06:30:00.000Z', '2026-11-01T07:30:00.000Z']).toContain(localInputToInstant('2026-11-01T01:30', 'America/Chicago')?.toISOString());
  });

  test('a date the calendar does not have, or another shape, is refused', () => {
    expect(localInputToInstant('2026-02-30T10:00', 'America/Chicago')).toBeNull();
    expect(localInputToInstant('2026-12-04 09:30', 'America/Chicago')).toBeNull();
    expect(localInputToInstant('tomorrow', 'America/Chicago')).toBeNull();
  });
});
