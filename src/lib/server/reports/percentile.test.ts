import { describe, expect, test } from 'vitest';
import { percentile } from './percentile';

describe('percentile', () => {
  // Source: Hyndman, R. J. and Fan, Y. (1996), "Sample Quantiles in Statistical Packages", The
  // American Statistician 50(4), definition 7: Q(p) = x[j] + (x[j+1] − x[j])·g with (n − 1)p = j + g
  // (x 1-based from j + 1). Worked by hand below.
  test('the median of an odd count is the middle value, of an even count the mean of the two middle ones', () => {
    expect(percentile([7, 1, 3], 0.5)).toBe(3);
    expect(percentile([4, 1, 3, 2], 0.5)).toBe(2.5);
  });

  test('the 90th percentile interpolates between the nearest ranks', () => {
    // n = 10 → (n − 1)·0.9 = 8.1: x9 + 0.1·(x10 − x9) = 90 + 0.1·10 = 91.
    expect(percentile([10, 20, 30, 40, 50, 60, 70, 80, 90, 100], 0.9)).toBeCloseTo(91, 10);
    // n = 4 → 2.7: x3 + 0.7·(x4 − x3) = 30 + 0.7·70 = 79.
    expect(percentile([100, 10, 30, 20], 0.9)).toBeCloseTo(79, 10);
  });

  test('one value is every percentile of itself; no values have none', () => {
    expect(percentile([42], 0.9)).toBe(42);
    expect(percentile([], 0.5)).toBeNull();
  });

  test('p outside 0–1 is a programming error', () => {
    expect(() => percentile([1], 90)).toThrow(RangeError);
  });
});
