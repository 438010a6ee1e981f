import { describe, expect, test } from 'vitest';
import { addDays, defaultReportRange, mondayOf, reportRangeSchema } from './report-range';

// Source: ISO 8601 weeks start on Monday; the weekdays of the days below are those of the
// Gregorian calendar (2026-12-04 is a Friday, 2024 is a leap year, 2026 is not).
const TODAY = '2026-12-04';
const parse = (query: Record<string, string>) => reportRangeSchema(TODAY).safeParse(query);
const fieldsOf = (query: Record<string, string>) => {
  const result = parse(query);
  return result.success
    ? null
    : Object.fromEntries(result.error.issues.map((issue) => [issue.path.join('.') || String((issue as { keys?: string[] }).keys), issue.message]));
};

describe('report days', () => {
  test('Monday of a week, across a month and a year end', () => {
    expect(mondayOf('2026-12-04')).toBe('2026-11-30');
    expect(mondayOf('2026-11-30')).toBe('2026-11-30');
    expect(mondayOf('2026-12-06')).toBe('2026-11-30'); // a Sunday
    expect(mondayOf('2027-01-01')).toBe('2026-12-28');
    expect(addDays('2024-02-28', 1)).toBe('2024-02-29');
  });

  test('by default the last twelve weeks, this one included', () => {
    expect(defaultReportRange(TODAY)).toEqual({ from: '2026-09-14', to: '2026-12-07' });
    expect(parse({}).data).toEqual({ from: '2026-09-14', to: '2026-12-07' });
    // An emptied field is the same as none.
    expect(parse({ from: '', to: '' }).data).toEqual({ from: '2026-09-14', to: '2026-12-07' });
  });

  test('one end given: twelve weeks from it or to it', () => {
    expect(parse({ from: '2026-01-05' }).data).toEqual({ from: '2026-01-05', to: '2026-03-30' });
    expect(parse({ to: '2026-03-30' }).data).toEqual({ from: '2026-01-05', to: '2026-03-30' });
  });
});

describe('refused ranges, each by its field', () => {
  test('a day that is not a date', () => {
    expect(Object.keys(fieldsOf({ from: '2026-02-30' })!)).toEqual(['from']);
    expect(Object.keys(fieldsOf({ from: '2025-02-29' })!)).toEqual(['from']);
    expect(Object.keys(fieldsOf({ to: '12/04/2026' })!)).toEqual(['to']);
    expect(Object.keys(fieldsOf({ from: '0099-01-01', to: '0099-02-01' })!)).toEqual(['from', 'to']);
    expect(parse({ from: '2024-02-29', to: '2024-03-01' }).success).toBe(true);
  });

  test('the end on or before the start, or more than two years after it', () => {
    expect(fieldsOf({ from: '2026-05-01', to: '2026-05-01' })).toEqual({ to: 'The day to stop before must come after the first day.' });
    expect(fieldsOf({ from: '2026-05-02', to: '2026-05-01' })).toEqual({ to: 'The day to stop before must come after the first day.' });
    expect(fieldsOf({ from: '2024-01-01', to: '2026-01-02' })).toEqual({ to: 'Ask for at most two years at once.' });
    // 731 days: two years with a leap day.
    expect(parse({ from: '2024-01-01', to: '2026-01-01' }).success).toBe(true);
  });

  test('a field the reports do not know', () => {
    expect(parse({ from: '2026-01-05', week: '3' }).success).toBe(false);
  });
});
