import { describe, expect, test } from 'vitest';
import { decodeCursor, encodeCursor } from './list-cursor';

// The cursor is our own format (common practice, no source): it must round-trip and refuse
// anything that is not one of ours.
const ID = '5f0c2a1e-4d3b-4c2a-9e1f-0a1b2c3d4e5f';

describe('list cursor', () => {
  test('round-trips a sort key with spaces, quotes and non-ASCII letters', () => {
    const cursor = { sort: 'name', dir: 'asc' as const, key: `o'brien "zoë" 2026-12-01 10:00:00.123456+00`, id: ID };
    const text = encodeCursor(cursor);
    expect(text).toMatch(/^[A-Za-z0-9_-]+$/);
    expect(decodeCursor(text)).toEqual(cursor);
  });

  test.each([
    ['not base64url', 'a+b/c='],
    ['not JSON', Buffer.from('nope').toString('base64url')],
    ['wrong shape', Buffer.from(JSON.stringify({ sort: 'name' })).toString('base64url')],
    ['bad direction', Buffer.from(JSON.stringify(['name', 'up', 'x', ID])).toString('base64url')],
    ['bad id', Buffer.from(JSON.stringify(['name', 'asc', 'x', '1; drop table lead'])).toString('base64url')],
    ['empty', ''],
  ])('refuses %s', (_what, text) => {
    expect(decodeCursor(text)).toBeNull();
  });
});
