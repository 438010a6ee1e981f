import { expect, test } from 'vitest';
import { refreshDelayMs } from './gallery';

// Our own timing rule: common practice, no source.
test('fresh photo links are asked for a minute before the old ones expire, and never in a tight loop', () => {
  const now = Date.parse('2026-12-03T12:00:00Z');
  expect(refreshDelayMs('2026-12-03T12:10:00Z', now)).toBe(9 * 60_000);
  expect(refreshDelayMs('2026-12-03T12:00:30Z', now)).toBe(5_000);
  expect(refreshDelayMs('2026-12-03T11:50:00Z', now)).toBe(5_000);
});
