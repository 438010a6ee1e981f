import { describe, expect, test } from 'vitest';
import { requestIdFor } from './request-id';

describe('requestIdFor', () => {
  test('keeps a plain incoming id', () => {
    expect(requestIdFor('req-4f1c.edge:7')).toBe('req-4f1c.edge:7');
  });

  test('makes a new random id when none came, or the one that came is not plain', () => {
    // Source: RFC 9562 section 5.4 (UUID version 4 layout: version nibble 4, variant bits 10).
    const uuid = /^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/;
    for (const incoming of [null, '', 'a'.repeat(129), 'line\nbreak', 'quote"s', 'spaces here', '<script>']) {
      expect(requestIdFor(incoming)).toMatch(uuid);
    }
    expect(requestIdFor(null)).not.toBe(requestIdFor(null));
  });
});
