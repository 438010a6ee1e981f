import { describe, expect, it } from 'vitest';
import { dayLabel, proofFromViewUrl, slotDays, timeLabel, visitLabel } from './visit-times';

// Source: IANA tz database, America/Chicago: CST (UTC−6) until 02:00 on Sunday 14 March 2027, then
// CDT (UTC−5) (the US rule: the second Sunday of March, docs/sources.md §70). English month, weekday
// and zone names: Unicode CLDR through ECMA-402 Intl.DateTimeFormat.
const CHICAGO = 'America/Chicago';

describe('visit times on the firm’s clock', () => {
  it('writes a time as the firm’s wall clock shows it, with the zone’s short name of that moment', () => {
    expect(dayLabel('2026-12-08T16:00:00.000Z', CHICAGO)).toBe('Tue, Dec 8');
    expect(timeLabel('2026-12-08T16:00:00.000Z', CHICAGO)).toBe('10:00 AM');
    expect(visitLabel('2026-12-08T16:00:00.000Z', CHICAGO)).toBe('Tue, Dec 8, 10:00 AM CST');
    // The day after the spring change: 10:00 CDT is 15:00 UTC.
    expect(visitLabel('2027-03-15T15:00:00.000Z', CHICAGO)).toBe('Mon, Mar 15, 10:00 AM CDT');
    expect(timeLabel('2026-12-08T19:30:00.000Z', CHICAGO)).toBe('1:30 PM');
  });

  it('groups times by the firm’s local day, not by UTC, and stops after the days asked for', () => {
    // 17:30 CST on the 8th is 23:30 UTC; 18:30 CST is already the 9th in UTC.
    const slots = [
      { start: '2026-12-09T00:30:00.000Z', end: '2026-12-09T01:30:00.000Z' },
      { start: '2026-12-08T23:30:00.000Z', end: '2026-12-09T00:30:00.000Z' },
      { start: '2026-12-09T15:00:00.000Z', end: '2026-12-09T16:00:00.000Z' },
      { start: '2026-12-11T15:00:00.000Z', end: '2026-12-11T16:00:00.000Z' },
    ];
    const days = slotDays(slots, CHICAGO);
    expect(days.map((d) => [d.date, d.label, d.slots.map((s) => s.time)])).toEqual([
      ['2026-12-08', 'Tue, Dec 8', ['5:30 PM', '6:30 PM']],
      ['2026-12-09', 'Wed, Dec 9', ['9:00 AM']],
      ['2026-12-11', 'Fri, Dec 11', ['9:00 AM']],
    ]);
    expect(slotDays(slots, CHICAGO, 2).map((d) => d.date)).toEqual(['2026-12-08', '2026-12-09']);
  });

  it('reads the inquiry and its key out of the private estimate link, and nothing out of anything else', () => {
    const id = '5f0c7a52-1d2e-4a57-9d0a-3c1b2e4f6a7b';
    expect(proofFromViewUrl(`https://app.lapwing.test/estimate/${id}?key=abc_DEF-123`)).toEqual({ lead: id, key: 'abc_DEF-123' });
    expect(proofFromViewUrl(null)).toBeNull();
    expect(proofFromViewUrl(`https://app.lapwing.test/estimate/${id}`)).toBeNull();
    expect(proofFromViewUrl('https://app.lapwing.test/somewhere?key=x')).toBeNull();
  });
});
