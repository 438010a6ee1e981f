import { describe, expect, test } from 'vitest';
import { fitLongEdge } from './fit-long-edge';

describe('fitLongEdge', () => {
  test('a 12-megapixel landscape frame comes down to 2000 × 1500', () => {
    expect(fitLongEdge(4000, 3000, 2000)).toEqual({ width: 2000, height: 1500 });
  });

  test('a portrait frame is limited by its height', () => {
    expect(fitLongEdge(3024, 4032, 2000)).toEqual({ width: 1500, height: 2000 });
  });

  test('an image already within the limit keeps its size', () => {
    expect(fitLongEdge(1600, 1200, 2000)).toEqual({ width: 1600, height: 1200 });
    expect(fitLongEdge(2000, 2000, 2000)).toEqual({ width: 2000, height: 2000 });
  });

  test('a very long, thin strip never gets a side of zero', () => {
    expect(fitLongEdge(40_000, 10, 2000)).toEqual({ width: 2000, height: 1 });
  });
});
