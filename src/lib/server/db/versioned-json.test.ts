import { describe, expect, test } from 'vitest';
import { z } from 'zod';
import { StoredJsonError, versionedJson } from './versioned-json';

// A shape that gained a field in version 2: older rows get the default from the upgrade step.
const shape = versionedJson({
  name: 'test shape',
  version: 2,
  schema: z.strictObject({ length: z.number(), coats: z.number() }),
  upgrades: { 0: (data) => data, 1: (data) => ({ ...(data as object), coats: 2 }) },
});

describe('versioned JSON', () => {
  test('what is written is read back unchanged, in an envelope that names its version', () => {
    const stored = shape.wrap({ length: 96, coats: 1 });
    expect(stored).toEqual({ schemaVersion: 2, data: { length: 96, coats: 1 } });
    expect(shape.read(JSON.parse(JSON.stringify(stored)))).toEqual({ length: 96, coats: 1 });
  });

  test('older versions and bare pre-envelope rows are upgraded step by step', () => {
    expect(shape.read({ schemaVersion: 1, data: { length: 96 } })).toEqual({ length: 96, coats: 2 });
    expect(shape.read({ length: 120 })).toEqual({ length: 120, coats: 2 });
  });

  test('data that no step or schema accepts, or a version from the future, is an error, not a guess', () => {
    expect(() => shape.read({ schemaVersion: 2, data: { length: 'long' } })).toThrow(StoredJsonError);
    expect(() => shape.read({ schemaVersion: 3, data: { length: 1, coats: 1 } })).toThrow(/newer than this program/);
  });
});
