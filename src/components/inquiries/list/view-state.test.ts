import { describe, expect, test } from 'vitest';
import { viewFromParams, viewQueryString, waitingText } from './view-state';

// The view's address is our own format (common practice, no source).
describe('the view in the address bar', () => {
  test('keeps what the schema accepts and drops the rest', () => {
    const view = viewFromParams(new URLSearchParams('q=maple&stage=new,spoken-to&finish=marble&overdue=1&sort=nope&dir=asc&limit=7'));
    expect(view).toEqual({ q: 'maple', stage: 'new,spoken-to', overdue: '1', dir: 'asc' });
  });

  test('the same view always writes the same address, in a fixed order', () => {
    expect(viewQueryString({ sort: 'score', q: 'dana', stage: 'new' })).toBe('q=dana&stage=new&sort=score');
    expect(viewQueryString({ stage: 'new', sort: 'score', q: 'dana' })).toBe('q=dana&stage=new&sort=score');
  });
});

describe('waitingText', () => {
  const now = Date.parse('2026-12-03T12:00:00Z');
  test.each([
    ['2026-12-03T11:15:00Z', '45 min'],
    ['2026-12-03T09:00:00Z', '3 h'],
    ['2026-12-01T13:00:00Z', '47 h'],
    ['2026-11-30T12:00:00Z', '3 d'],
    ['2026-12-03T12:05:00Z', '0 min'],
  ])('since %s: %s', (since, text) => {
    expect(waitingText(since, now)).toBe(text);
  });
});
