import { describe, expect, test } from 'vitest';
import { jsonChanges } from './json-changes';

describe('jsonChanges', () => {
  test('names each changed leaf by its dotted path, lists by position', () => {
    const before = { labour: { rateCents: 6500, hoursPerCorner: 0.25 }, sheets: [{ id: 'a', priceCents: 100 }] };
    const after = { labour: { rateCents: 7000, hoursPerCorner: 0.25 }, sheets: [{ id: 'a', priceCents: 120 }] };
    expect(jsonChanges(before, after)).toEqual([
      { path: 'labour.rateCents', before: 6500, after: 7000 },
      { path: 'sheets.0.priceCents', before: 100, after: 120 },
    ]);
  });

  test('a row added to a list shows each of its leaves as new', () => {
    expect(jsonChanges({ zones: [] }, { zones: [{ id: 'north', feeCents: 5000 }] })).toEqual([
      { path: 'zones.0.id', before: undefined, after: 'north' },
      { path: 'zones.0.feeCents', before: undefined, after: 5000 },
    ]);
  });

  test('an optional field left out on one side, and equal values, are told apart', () => {
    expect(jsonChanges({ a: 1, b: 'x' }, { a: 1 })).toEqual([{ path: 'b', before: 'x', after: undefined }]);
    expect(jsonChanges({ a: [1, 2] }, { a: [1, 2] })).toEqual([]);
  });

  test('a leaf replaced by an object lists the old value and the new leaves once each', () => {
    expect(jsonChanges({ casing: 2 }, { casing: { width: 2.25 } })).toEqual([
      { path: 'casing', before: 2, after: undefined },
      { path: 'casing.width', before: undefined, after: 2.25 },
    ]);
  });
});
