import { fc, test as fcTest } from '@fast-check/vitest';
import { describe, expect, test } from 'vitest';
import { openSlots, SlotInputError, type OpenSlotsInput } from './index.ts';

// Source: IANA tz database (US: second Sunday of March / first Sunday of November at 02:00 local; EU: last Sunday of March / October at 01:00 UTC); docs/sources.md §70
// In 2026 that is 2026-03-08 and 2026-11-01 for America/New_York (EST = UTC−5, EDT = UTC−4) and
// 2026-03-29 and 2026-10-25 for Europe/London (GMT = UTC+0, BST = UTC+1). All four are Sundays.
// Every expected instant below is written in UTC from those offsets.

const OFFICE_HOURS = [
  { from: '09:00', to: '12:00' },
  { from: '13:00', to: '18:00' },
];

function slotsFor(overrides: Partial<OpenSlotsInput> & Pick<OpenSlotsInput, 'timeZone' | 'now'>): OpenSlotsInput {
  return { weekly: { sun: OFFICE_HOURS }, visitMinutes: 60, bufferMinutes: 0, stepMinutes: 60, minNoticeMinutes: 0, horizonDays: 1, busy: [], ...overrides };
}

const starts = (input: OpenSlotsInput) => openSlots(input).map((slot) => slot.start.toISOString());
const utc = (...times: string[]) => times.map((t) => new Date(t).toISOString());

describe('office hours on the days the clocks change', () => {
  test('New York, spring forward (2026-03-08): hours are read under EDT, UTC−4', () => {
    const slots = starts(slotsFor({ timeZone: 'America/New_York', now: new Date('2026-03-07T12:00:00Z') }));
    expect(slots).toEqual(
      utc(
        '2026-03-08T13:00Z',
        '2026-03-08T14:00Z',
        '2026-03-08T15:00Z',
        '2026-03-08T17:00Z',
        '2026-03-08T18:00Z',
        '2026-03-08T19:00Z',
        '2026-03-08T20:00Z',
        '2026-03-08T21:00Z',
      ),
    );
  });

  test('New York, fall back (2026-11-01): hours are read under EST, UTC−5', () => {
    const slots = starts(slotsFor({ timeZone: 'America/New_York', now: new Date('2026-10-31T12:00:00Z') }));
    expect(slots).toEqual(
      utc(
        '2026-11-01T14:00Z',
        '2026-11-01T15:00Z',
        '2026-11-01T16:00Z',
        '2026-11-01T18:00Z',
        '2026-11-01T19:00Z',
        '2026-11-01T20:00Z',
        '2026-11-01T21:00Z',
        '2026-11-01T22:00Z',
      ),
    );
  });

  test('London, spring forward (2026-03-29): hours are read under BST, UTC+1', () => {
    const slots = starts(slotsFor({ timeZone: 'Europe/London', now: new Date('2026-03-28T12:00:00Z') }));
    expect(slots).toEqual(
      utc(
        '2026-03-29T08:00Z',
        '2026-03-29T09:00Z',
        '2026-03-29T10:00Z',
        '2026-03-29T12:00Z',
        '2026-03-29T13:00Z',
        '2026-03-29T14:00Z',
        '2026-03-29T15:00Z',
        '2026-03-29T16:00Z',
      ),
    );
  });

  test('London, fall back (2026-10-25): hours are read under GMT, UTC+0', () => {
    const slots = starts(slotsFor({ timeZone: 'Europe/London', now: new Date('2026-10-24T12:00:00Z') }));
    expect(slots).toEqual(
      utc(
        '2026-10-25T09:00Z',
        '2026-10-25T10:00Z',
        '2026-10-25T11:00Z',
        '2026-10-25T13:00Z',
        '2026-10-25T14:00Z',
        '2026-10-25T15:00Z',
        '2026-10-25T16:00Z',
        '2026-10-25T17:00Z',
      ),
    );
  });

  test('each slot lasts the visit in real time', () => {
    for (const slot of openSlots(slotsFor({ timeZone: 'America/New_York', now: new Date('2026-10-31T12:00:00Z'), visitMinutes: 45, stepMinutes: 30 }))) {
      expect(slot.end.getTime() - slot.start.getTime()).toBe(45 * 60_000);
    }
  });

  test('a minimum notice that ends on the change day is counted in real minutes', () => {
    // Saturday 20:00 EST (2026-03-08T01:00Z) plus 15 hours is 16:00 UTC, 12:00 EDT on Sunday (the
    // night lost an hour), so the 11:00 EDT slot (15:00 UTC) is too soon and 13:00 EDT is the first.
    const slots = starts(slotsFor({ timeZone: 'America/New_York', now: new Date('2026-03-08T01:00:00Z'), minNoticeMinutes: 15 * 60 }));
    expect(slots[0]).toBe('2026-03-08T17:00:00.000Z');
    expect(slots).not.toContain('2026-03-08T15:00:00.000Z');
    // Same in London: Saturday 18:00 GMT plus 16 hours is 10:00 UTC, 11:00 BST: 11:00 BST is kept.
    const london = starts(slotsFor({ timeZone: 'Europe/London', now: new Date('2026-03-28T18:00:00Z'), minNoticeMinutes: 16 * 60 }));
    expect(london[0]).toBe('2026-03-29T10:00:00.000Z');
  });
});

describe('a range whose wall clock 01:00–03:00 crosses the change', () => {
  const night = { sun: [{ from: '01:00', to: '03:00' }] };

  test('New York spring forward: 02:00 and 02:30 never happen that night and are skipped, not moved', () => {
    const input = slotsFor({ timeZone: 'America/New_York', now: new Date('2026-03-07T12:00:00Z'), weekly: night, stepMinutes: 30, visitMinutes: 30 });
    // 01:00 and 01:30 EST; the 01:30 visit ends at 07:00 UTC, 03:00 EDT, exactly at `to`.
    expect(starts(input)).toEqual(utc('2026-03-08T06:00Z', '2026-03-08T06:30Z'));
  });

  test('New York spring forward: a skipped start is not moved onto 03:00 EDT (which would offer 03:00 twice)', () => {
    const input = slotsFor({
      timeZone: 'America/New_York',
      now: new Date('2026-03-07T12:00:00Z'),
      weekly: { sun: [{ from: '01:00', to: '04:00' }] },
      stepMinutes: 30,
      visitMinutes: 30,
    });
    // 01:00 and 01:30 EST, then 03:00 and 03:30 EDT.
    expect(starts(input)).toEqual(utc('2026-03-08T06:00Z', '2026-03-08T06:30Z', '2026-03-08T07:00Z', '2026-03-08T07:30Z'));
  });

  test('New York spring forward: a 60-minute visit at 01:30 EST would end 03:30 EDT on the wall clock, past `to`', () => {
    const input = slotsFor({ timeZone: 'America/New_York', now: new Date('2026-03-07T12:00:00Z'), weekly: night, stepMinutes: 30, visitMinutes: 60 });
    expect(openSlots(input).map((s) => [s.start.toISOString(), s.end.toISOString()])).toEqual([['2026-03-08T06:00:00.000Z', '2026-03-08T07:00:00.000Z']]);
  });

  test('New York fall back: 01:00 and 01:30 are taken at their first showing (EDT), then 02:00 and 02:30 EST', () => {
    const input = slotsFor({ timeZone: 'America/New_York', now: new Date('2026-10-31T12:00:00Z'), weekly: night, stepMinutes: 30, visitMinutes: 30 });
    expect(starts(input)).toEqual(utc('2026-11-01T05:00Z', '2026-11-01T05:30Z', '2026-11-01T07:00Z', '2026-11-01T07:30Z'));
  });

  test('New York fall back: with 60-minute visits the 02:30 EST start would end 03:30 and is refused', () => {
    const input = slotsFor({ timeZone: 'America/New_York', now: new Date('2026-10-31T12:00:00Z'), weekly: night, stepMinutes: 30, visitMinutes: 60 });
    expect(starts(input)).toEqual(utc('2026-11-01T05:00Z', '2026-11-01T05:30Z', '2026-11-01T07:00Z'));
  });

  test('London spring forward: 01:00 and 01:30 never happen (the clock goes from 01:00 GMT to 02:00 BST)', () => {
    const input = slotsFor({ timeZone: 'Europe/London', now: new Date('2026-03-28T12:00:00Z'), weekly: night, stepMinutes: 30, visitMinutes: 30 });
    expect(starts(input)).toEqual(utc('2026-03-29T01:00Z', '2026-03-29T01:30Z'));
  });

  test('London fall back: 01:00 and 01:30 are taken under BST (their first showing), not GMT', () => {
    const input = slotsFor({ timeZone: 'Europe/London', now: new Date('2026-10-24T12:00:00Z'), weekly: night, stepMinutes: 30, visitMinutes: 30 });
    expect(starts(input)).toEqual(utc('2026-10-25T00:00Z', '2026-10-25T00:30Z', '2026-10-25T02:00Z', '2026-10-25T02:30Z'));
  });

  test('London fall back: a 90-minute visit from 01:30 BST ends 02:00 GMT on the wall clock; from 02:00 GMT it would pass 03:00', () => {
    const input = slotsFor({ timeZone: 'Europe/London', now: new Date('2026-10-24T12:00:00Z'), weekly: night, stepMinutes: 30, visitMinutes: 90 });
    expect(openSlots(input).map((s) => [s.start.toISOString(), s.end.toISOString()])).toEqual([
      ['2026-10-25T00:00:00.000Z', '2026-10-25T01:30:00.000Z'],
      ['2026-10-25T00:30:00.000Z', '2026-10-25T02:00:00.000Z'],
    ]);
  });
});

describe('busy time and its buffer', () => {
  // Tuesday 2026-03-10 in New York is under EDT (UTC−4): 09:00 is 13:00 UTC.
  const tuesday = (busy: OpenSlotsInput['busy'], bufferMinutes: number) =>
    starts(
      slotsFor({
        timeZone: 'America/New_York',
        now: new Date('2026-03-10T05:00:00Z'),
        horizonDays: 0,
        weekly: { tue: OFFICE_HOURS },
        stepMinutes: 30,
        busy,
        bufferMinutes,
      }),
    );

  test('a slot touching a busy range widened by the buffer is kept, one overlapping it is refused', () => {
    const busy = [
      // 11:00–12:00 EDT, widened by 30 minutes to 10:30–12:30.
      { start: new Date('2026-03-10T15:00:00Z'), end: new Date('2026-03-10T16:00:00Z') },
      // 15:00–15:30 EDT, widened to 14:30–16:00.
      { start: new Date('2026-03-10T19:00:00Z'), end: new Date('2026-03-10T19:30:00Z') },
    ];
    expect(tuesday(busy, 30)).toEqual(
      utc(
        '2026-03-10T13:00Z', // 09:00–10:00
        '2026-03-10T13:30Z', // 09:30–10:30 ends where the widened busy range starts: kept
        '2026-03-10T17:00Z', // 13:00–14:00 starts after the widened range ends at 12:30
        '2026-03-10T17:30Z', // 13:30–14:30 touches 14:30: kept
        '2026-03-10T20:00Z', // 16:00–17:00 starts where the widened range ends: kept
        '2026-03-10T20:30Z',
        '2026-03-10T21:00Z', // 17:00–18:00 ends exactly at `to`
      ),
    );
  });

  test('without a buffer a slot may end as a busy range starts and start as it ends', () => {
    const busy = [{ start: new Date('2026-03-10T14:00:00Z'), end: new Date('2026-03-10T15:00:00Z') }];
    const slots = tuesday(busy, 0);
    expect(slots).toContain('2026-03-10T13:00:00.000Z');
    expect(slots).toContain('2026-03-10T15:00:00.000Z');
    expect(slots).not.toContain('2026-03-10T13:30:00.000Z');
    expect(slots).not.toContain('2026-03-10T14:30:00.000Z');
  });

  test('one minute of overlap is enough to refuse a slot', () => {
    const busy = [{ start: new Date('2026-03-10T13:59:00Z'), end: new Date('2026-03-10T14:00:00Z') }];
    expect(tuesday(busy, 0)[0]).toBe('2026-03-10T14:00:00.000Z');
  });

  test('busy ranges given in any order, overlapping each other, are all kept free', () => {
    const busy = [
      { start: new Date('2026-03-10T20:00:00Z'), end: new Date('2026-03-10T22:00:00Z') },
      { start: new Date('2026-03-10T13:00:00Z'), end: new Date('2026-03-10T15:00:00Z') },
      { start: new Date('2026-03-10T14:00:00Z'), end: new Date('2026-03-10T18:00:00Z') },
    ];
    expect(tuesday(busy, 0)).toEqual(utc('2026-03-10T18:00Z', '2026-03-10T18:30Z', '2026-03-10T19:00Z'));
  });
});

describe('days off, the horizon and the firm’s own calendar', () => {
  test('a day off is the firm’s local date, not the UTC one', () => {
    // Source: IANA tz database (New Zealand: daylight time from the last Sunday of September to the
    // first Sunday of April), so Auckland is UTC+13 on 2026-03-10 and its 09:00 there is 20:00 UTC
    // the day before.
    const input = slotsFor({
      timeZone: 'Pacific/Auckland',
      now: new Date('2026-03-09T00:00:00Z'),
      horizonDays: 3,
      weekly: { tue: [{ from: '09:00', to: '10:00' }] },
    });
    expect(starts(input)).toEqual(utc('2026-03-09T20:00Z'));
    expect(starts({ ...input, daysOff: ['2026-03-09'] })).toEqual(utc('2026-03-09T20:00Z'));
    expect(starts({ ...input, daysOff: ['2026-03-10'] })).toEqual([]);
  });

  test('a day off removes only that day', () => {
    const input = slotsFor({
      timeZone: 'America/New_York',
      now: new Date('2026-03-09T04:00:00Z'),
      horizonDays: 2,
      weekly: { mon: [{ from: '09:00', to: '10:00' }], tue: [{ from: '09:00', to: '10:00' }] },
    });
    expect(starts({ ...input, daysOff: ['2026-03-09'] })).toEqual(utc('2026-03-10T13:00Z'));
  });

  test('today is `now`’s local date: horizon 0 offers only today, 1 adds tomorrow', () => {
    // 2026-03-08T03:00Z is still Saturday 2026-03-07, 22:00 EST, in New York (UTC already says Sunday).
    const now = new Date('2026-03-08T03:00:00Z');
    const weekly = { sat: [{ from: '22:00', to: '23:30' }], sun: [{ from: '09:00', to: '10:00' }], mon: [{ from: '09:00', to: '10:00' }] };
    const input = slotsFor({ timeZone: 'America/New_York', now, weekly });
    expect(starts({ ...input, horizonDays: 0 })).toEqual(utc('2026-03-08T03:00Z'));
    expect(starts({ ...input, horizonDays: 1 })).toEqual(utc('2026-03-08T03:00Z', '2026-03-08T13:00Z'));
    expect(starts({ ...input, horizonDays: 2 })).toEqual(utc('2026-03-08T03:00Z', '2026-03-08T13:00Z', '2026-03-09T13:00Z'));
  });
});

describe('the grid of starts', () => {
  const on = (stepMinutes: number, visitMinutes: number) =>
    openSlots(
      slotsFor({
        timeZone: 'UTC',
        now: new Date('2026-06-07T00:00:00Z'),
        horizonDays: 0,
        weekly: { sun: [{ from: '09:00', to: '12:00' }] },
        stepMinutes,
        visitMinutes,
      }),
    ).map((s) => s.start.toISOString().slice(11, 16));

  test('a step shorter than the visit gives overlapping choices, each ending by `to`', () => {
    expect(on(30, 90)).toEqual(['09:00', '09:30', '10:00', '10:30']);
    expect(on(45, 60)).toEqual(['09:00', '09:45', '10:30']);
  });

  test('a step longer than the visit leaves gaps between choices', () => {
    expect(on(90, 30)).toEqual(['09:00', '10:30']);
    expect(on(240, 30)).toEqual(['09:00']);
  });

  test('a visit as long as the range fits once; a longer one never', () => {
    expect(on(15, 180)).toEqual(['09:00']);
    expect(on(15, 181)).toEqual([]);
  });

  test('steps count from each range’s own start', () => {
    const slots = openSlots(
      slotsFor({
        timeZone: 'UTC',
        now: new Date('2026-06-07T00:00:00Z'),
        horizonDays: 0,
        weekly: {
          sun: [
            { from: '13:10', to: '15:00' },
            { from: '09:00', to: '10:00' },
          ],
        },
        stepMinutes: 40,
        visitMinutes: 30,
      }),
    ).map((s) => s.start.toISOString().slice(11, 16));
    expect(slots).toEqual(['09:00', '13:10', '13:50', '14:30']);
  });
});

describe('exact boundaries (half-open intervals)', () => {
  const sunday = (minNoticeMinutes: number) =>
    starts(
      slotsFor({ timeZone: 'UTC', now: new Date('2026-06-07T08:00:00Z'), horizonDays: 0, weekly: { sun: [{ from: '09:00', to: '11:00' }] }, minNoticeMinutes }),
    );

  test('a slot starting exactly at now + minimum notice is kept; a minute more notice refuses it', () => {
    expect(sunday(60)).toEqual(utc('2026-06-07T09:00Z', '2026-06-07T10:00Z'));
    expect(sunday(61)).toEqual(utc('2026-06-07T10:00Z'));
  });

  test('a start equal to `to` is not offered, and the visit may end exactly at `to`', () => {
    const input = slotsFor({
      timeZone: 'UTC',
      now: new Date('2026-06-07T00:00:00Z'),
      horizonDays: 0,
      weekly: { sun: [{ from: '09:00', to: '10:00' }] },
      stepMinutes: 60,
      visitMinutes: 60,
    });
    expect(openSlots(input).map((s) => [s.start.toISOString(), s.end.toISOString()])).toEqual([['2026-06-07T09:00:00.000Z', '2026-06-07T10:00:00.000Z']]);
  });

  test('a visit may not run past midnight into the next local date', () => {
    const input = slotsFor({
      timeZone: 'UTC',
      now: new Date('2026-06-07T00:00:00Z'),
      horizonDays: 1,
      weekly: { sun: [{ from: '23:00', to: '23:59' }] },
      visitMinutes: 60,
    });
    expect(starts(input)).toEqual([]);
    expect(starts({ ...input, visitMinutes: 59 })).toEqual(utc('2026-06-07T23:00Z'));
  });

  test('a horizon of 0 with no hours left today gives nothing', () => {
    expect(starts(slotsFor({ timeZone: 'UTC', now: new Date('2026-06-07T20:00:00Z'), horizonDays: 0 }))).toEqual([]);
  });
});

describe('input it cannot use', () => {
  const good = slotsFor({ timeZone: 'Europe/London', now: new Date('2026-06-07T00:00:00Z') });
  const refusal = (input: unknown) => {
    try {
      openSlots(input as OpenSlotsInput);
    } catch (error) {
      expect(error).toBeInstanceOf(SlotInputError);
      return (error as SlotInputError).path;
    }
    throw new Error('openSlots accepted it');
  };

  test.each([
    ['an unknown zone', { timeZone: 'Europe/Atlantis' }, 'timeZone'],
    ['an empty zone', { timeZone: '' }, 'timeZone'],
    [
      'a malformed time',
      {
        weekly: {
          mon: [
            { from: '09:00', to: '12:00' },
            { from: '13:00', to: '6pm' },
          ],
        },
      },
      'weekly.mon.1.to',
    ],
    ['a time past 23:59', { weekly: { tue: [{ from: '24:00', to: '24:30' }] } }, 'weekly.tue.0.from'],
    ['an end equal to its start', { weekly: { wed: [{ from: '09:00', to: '09:00' }] } }, 'weekly.wed.0.to'],
    ['an end before its start', { weekly: { wed: [{ from: '09:00', to: '08:00' }] } }, 'weekly.wed.0.to'],
    [
      'overlapping ranges on one day',
      {
        weekly: {
          thu: [
            { from: '09:00', to: '12:00' },
            { from: '11:00', to: '13:00' },
          ],
        },
      },
      'weekly.thu.1.from',
    ],
    ['an unknown weekday', { weekly: { monday: [] } }, 'weekly.monday'],
    ['too many ranges a day', { weekly: { fri: Array.from({ length: 25 }, (_, i) => ({ from: hhmm(i * 30), to: hhmm(i * 30 + 15) })) } }, 'weekly.fri'],
    ['a day off that is no date', { daysOff: ['2026-02-30'] }, 'daysOff.0'],
    ['a day off in another format', { daysOff: ['2026-03-01', '03/08/2026'] }, 'daysOff.1'],
    ['a negative buffer', { bufferMinutes: -5 }, 'bufferMinutes'],
    ['a negative notice', { minNoticeMinutes: -1 }, 'minNoticeMinutes'],
    ['a zero step', { stepMinutes: 0 }, 'stepMinutes'],
    ['a zero visit', { visitMinutes: 0 }, 'visitMinutes'],
    ['a visit of NaN minutes', { visitMinutes: Number.NaN }, 'visitMinutes'],
    ['an infinite step', { stepMinutes: Number.POSITIVE_INFINITY }, 'stepMinutes'],
    ['a fraction of a minute', { stepMinutes: 7.5 }, 'stepMinutes'],
    ['a negative horizon', { horizonDays: -1 }, 'horizonDays'],
    ['a horizon beyond the cap', { horizonDays: 367 }, 'horizonDays'],
    ['an invalid now', { now: new Date('not a date') }, 'now'],
    ['a busy range with an invalid start', { busy: [{ start: new Date(Number.NaN), end: new Date() }] }, 'busy.0.start'],
    ['a busy range ending before it starts', { busy: [{ start: new Date('2026-06-07T10:00Z'), end: new Date('2026-06-07T09:00Z') }] }, 'busy.0.end'],
  ])('%s is refused at its field', (_what, change, path) => {
    expect(refusal({ ...good, ...change })).toBe(path);
  });

  test('the error says the cap it met', () => {
    expect(() => openSlots({ ...good, horizonDays: 400 })).toThrow(/366/);
  });

  test('every fault is listed by field for the caller to show', () => {
    try {
      openSlots({ ...good, timeZone: 'Nowhere/None', visitMinutes: -1 });
      throw new Error('accepted');
    } catch (error) {
      expect(error).toBeInstanceOf(SlotInputError);
      expect(Object.keys((error as SlotInputError).fields)).toEqual(['timeZone', 'visitMinutes']);
    }
  });
});

// ---------------------------------------------------------------------------------------------
// Property: against a slow, independent reading of the same rules. It walks real time minute by
// minute and reads the zone's clock with Intl.DateTimeFormat (not @date-fns/tz), so a wall-clock
// time is "first shown" at the first minute it appears.

// Each zone with the days before its changes of 2026 (and a quiet week), so the walk crosses them.
// Source: IANA tz database (US and Canada: second Sunday of March / first Sunday of November at
// 02:00 local; EU: last Sunday of March / October at 01:00 UTC; New Zealand and Chatham: last
// Sunday of September / first Sunday of April; Lord Howe: first Sunday of October / April, a
// 30-minute change).
const ZONE_WEEKS: [string, string][] = [
  ['America/New_York', '2026-03-07T00:00Z'],
  ['America/New_York', '2026-10-31T00:00Z'],
  ['America/St_Johns', '2026-03-07T00:00Z'],
  ['America/St_Johns', '2026-10-31T00:00Z'],
  ['Europe/London', '2026-03-28T00:00Z'],
  ['Europe/London', '2026-10-24T00:00Z'],
  ['Australia/Lord_Howe', '2026-04-03T12:00Z'],
  ['Australia/Lord_Howe', '2026-10-02T12:00Z'],
  ['Pacific/Chatham', '2026-04-03T12:00Z'],
  ['Pacific/Chatham', '2026-09-25T12:00Z'],
  ['Pacific/Auckland', '2026-04-03T12:00Z'],
  ['Asia/Kolkata', '2026-06-10T00:00Z'],
  ['UTC', '2026-06-10T00:00Z'],
];
const DAY_NAMES: Record<string, string> = { Sun: 'sun', Mon: 'mon', Tue: 'tue', Wed: 'wed', Thu: 'thu', Fri: 'fri', Sat: 'sat' };
const MINUTE = 60_000;

const clocks = new Map<string, Intl.DateTimeFormat>();
function clockAt(at: number, timeZone: string) {
  let f = clocks.get(timeZone);
  if (!f)
    clocks.set(
      timeZone,
      (f = new Intl.DateTimeFormat('en-US', {
        timeZone,
        hourCycle: 'h23',
        weekday: 'short',
        year: 'numeric',
        month: '2-digit',
        day: '2-digit',
        hour: '2-digit',
        minute: '2-digit',
      })),
    );
  const p = Object.fromEntries(f.formatToParts(new Date(at)).map((part) => [part.type, part.value]));
  return { date: `${p.year}-${p.month}-${p.day}`, weekday: DAY_NAMES[p.weekday!]!, minutes: Number(p.hour) * 60 + Number(p.minute) };
}
const hhmm = (m: number) => `${String(Math.floor(m / 60)).padStart(2, '0')}:${String(m % 60).padStart(2, '0')}`;
const addCalendarDays = (date: string, days: number) => new Date(Date.parse(`${date}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);

function slowSlots(input: OpenSlotsInput): string[] {
  const { timeZone, now, horizonDays, stepMinutes, visitMinutes, bufferMinutes, minNoticeMinutes } = input;
  const today = clockAt(now.getTime(), timeZone).date;
  const lastDate = addCalendarDays(today, horizonDays);
  const earliest = now.getTime() + minNoticeMinutes * MINUTE;
  const seen = new Set<string>();
  const found: string[] = [];
  // From well before today's local midnight (no zone is more than 14 hours off UTC), so a time shown
  // twice is first seen at its first showing.
  const first = Math.floor(now.getTime() / MINUTE) * MINUTE - 27 * 3_600_000;
  for (let at = first; at <= now.getTime() + (horizonDays + 1) * 86_400_000 + 27 * 3_600_000; at += MINUTE) {
    const wall = clockAt(at, timeZone);
    const key = `${wall.date} ${wall.minutes}`;
    if (seen.has(key)) continue;
    seen.add(key);
    if (wall.date < today || wall.date > lastDate || input.daysOff?.includes(wall.date) || at < earliest) continue;
    const onGrid = (input.weekly[wall.weekday as 'mon'] ?? [])
      .map((r) => [r.from, r.to].map((t) => Number(t.slice(0, 2)) * 60 + Number(t.slice(3))) as [number, number])
      .find(([from, to]) => wall.minutes >= from && wall.minutes < to && (wall.minutes - from) % stepMinutes === 0);
    if (!onGrid) continue;
    const end = at + visitMinutes * MINUTE;
    const endWall = clockAt(end, timeZone);
    const fits = endWall.date === wall.date && endWall.minutes <= onGrid[1];
    const clash = input.busy.some((b) => at < b.end.getTime() + bufferMinutes * MINUTE && end > b.start.getTime() - bufferMinutes * MINUTE);
    if (fits && !clash) found.push(new Date(at).toISOString());
  }
  return found;
}

const weekdayRanges = fc
  .uniqueArray(fc.integer({ min: 0, max: 24 * 4 - 1 }), { minLength: 0, maxLength: 4 })
  .map((quarters) => quarters.sort((a, b) => a - b))
  .map((q) => {
    const ranges: { from: string; to: string }[] = [];
    for (let i = 0; i + 1 < q.length; i += 2) ranges.push({ from: hhmm(q[i]! * 15), to: hhmm(q[i + 1]! * 15) });
    return ranges;
  });

// A range over the small hours, where every change of these zones falls (all on a Sunday).
const nightRange = fc
  .record({ from: fc.integer({ min: 0, max: 8 }), to: fc.integer({ min: 12, max: 20 }) })
  .map(({ from, to }) => [{ from: hhmm(from * 15), to: hhmm(to * 15) }]);

// Minutes that are often round (so slots and busy ranges meet exactly), sometimes not.
const minutes = (round: number[], min: number, max: number) => fc.oneof(fc.constantFrom(...round), fc.integer({ min, max }));

const slotInput = fc
  .record({
    zoneWeek: fc.constantFrom(...ZONE_WEEKS),
    nowMinutes: fc.integer({ min: 0, max: 36 * 60 }),
    nowSeconds: fc.constantFrom(0, 17),
    weekly: fc.record(
      {
        sun: fc.oneof(nightRange, weekdayRanges),
        mon: weekdayRanges,
        tue: weekdayRanges,
        wed: weekdayRanges,
        thu: weekdayRanges,
        fri: weekdayRanges,
        sat: weekdayRanges,
      },
      { requiredKeys: ['sun'] },
    ),
    daysOffAhead: fc.uniqueArray(fc.integer({ min: 0, max: 3 }), { maxLength: 2 }),
    visitMinutes: minutes([15, 30, 45, 60, 90], 5, 180),
    bufferMinutes: minutes([0, 15, 30], 0, 90),
    stepMinutes: minutes([15, 30, 60], 5, 120),
    minNoticeMinutes: minutes([0, 60, 240], 0, 24 * 60),
    horizonDays: fc.integer({ min: 0, max: 2 }),
    busy: fc.array(fc.record({ startQuarter: fc.integer({ min: 0, max: 4 * 24 * 4 }), lengthMinutes: minutes([15, 60], 0, 300) }), { maxLength: 5 }),
  })
  .map(({ zoneWeek: [timeZone, around], nowMinutes, nowSeconds, daysOffAhead, busy, ...rest }): OpenSlotsInput => {
    const anchor = Date.parse(around);
    const now = new Date(anchor + nowMinutes * MINUTE + nowSeconds * 1000);
    const today = clockAt(now.getTime(), timeZone).date;
    return {
      ...rest,
      timeZone,
      now,
      daysOff: daysOffAhead.map((d) => addCalendarDays(today, d)),
      // On quarter hours of the anchor, which are quarter hours of every zone listed (offsets of :00, :30, :45).
      busy: busy.map((b) => ({
        start: new Date(anchor + b.startQuarter * 15 * MINUTE),
        end: new Date(anchor + (b.startQuarter * 15 + b.lengthMinutes) * MINUTE),
      })),
    };
  });

describe('open slots, for any zone, hours, busy time and step', () => {
  fcTest.prop([slotInput], { ...(process.env.SLOTS_SEED === 'random' ? {} : { seed: 20261203 }), numRuns: Number(process.env.SLOTS_RUNS ?? 50) })(
    'keep every rule, checked on the zone’s clock through Intl',
    (input) => {
      const slots = openSlots(input);
      const today = clockAt(input.now.getTime(), input.timeZone).date;
      for (const [i, slot] of slots.entries()) {
        const [start, end] = [slot.start.getTime(), slot.end.getTime()];
        if (i > 0) expect(start).toBeGreaterThan(slots[i - 1]!.start.getTime());
        expect(end - start).toBe(input.visitMinutes * MINUTE);
        expect(start).toBeGreaterThanOrEqual(input.now.getTime() + input.minNoticeMinutes * MINUTE);
        for (const b of input.busy)
          expect(start < b.end.getTime() + input.bufferMinutes * MINUTE && end > b.start.getTime() - input.bufferMinutes * MINUTE).toBe(false);
        const [wallStart, wallEnd] = [clockAt(start, input.timeZone), clockAt(end, input.timeZone)];
        expect(input.daysOff).not.toContain(wallStart.date);
        expect(wallStart.date <= addCalendarDays(today, input.horizonDays)).toBe(true);
        expect(wallEnd.date).toBe(wallStart.date);
        const inside = (input.weekly[wallStart.weekday as 'mon'] ?? []).some(
          (r) => r.from <= hhmm(wallStart.minutes) && hhmm(wallStart.minutes) < r.to && hhmm(wallEnd.minutes) <= r.to,
        );
        expect(inside).toBe(true);
      }
      expect(slots.map((s) => s.start.toISOString())).toEqual(slowSlots(input));
    },
    // The slow reading walks every minute of a few days; on a busy machine that takes a while.
    60_000,
  );
});
