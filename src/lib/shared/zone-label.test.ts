import { describe, expect, it } from 'vitest';
import { zoneLabel } from './zone-label';

// Source: docs/sources.md §71. Unicode CLDR time zone names as carried by ECMA-402 Intl.DateTimeFormat (timeZoneName
// "longGeneric" and "short", ECMA-402 §11.1.2); UTS #35 Part 4 §7 "Using Time Zone Names" (generic
// non-location format "Central Time", specific non-location format "CST"). Offsets and clock changes:
// IANA tz database, America/Chicago and Europe/London (docs/sources.md §70).
describe('zoneLabel', () => {
  it('names the zone and its short name in winter and in summer', () => {
    expect(zoneLabel('America/Chicago', new Date('2026-12-08T16:00:00Z'))).toBe('Central Time (CST)');
    expect(zoneLabel('America/Chicago', new Date('2027-07-08T16:00:00Z'))).toBe('Central Time (CDT)');
    expect(zoneLabel('America/New_York', new Date('2026-12-08T16:00:00Z'))).toBe('Eastern Time (EST)');
  });

  it('falls back to the short name where English has no generic one, and to UTC for an unknown zone', () => {
    expect(zoneLabel('Asia/Kolkata', new Date('2026-12-08T16:00:00Z'))).toBe('India Standard Time (GMT+5:30)');
    expect(zoneLabel('Etc/GMT-3', new Date('2026-12-08T16:00:00Z'))).toBe('GMT+3');
    expect(zoneLabel('Not/AZone', new Date('2026-12-08T16:00:00Z'))).toBe('UTC');
    expect(zoneLabel('UTC', new Date('2026-12-08T16:00:00Z'))).toBe('UTC');
  });
});
