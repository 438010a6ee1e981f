import { describe, expect, test } from 'vitest';
import { fillPlaceholders, unknownPlaceholders } from './mail-placeholders';

// Our own placeholder syntax: common practice, no source.
describe('template placeholders', () => {
  test('are filled with the values given and left alone otherwise', () => {
    expect(fillPlaceholders('Hello {name}, see {estimate_link}', { name: 'Dana' })).toBe('Hello Dana, see {estimate_link}');
    expect(fillPlaceholders('{firm} and {firm}', { firm: 'Cedar Hollow Trim Co.' })).toBe('Cedar Hollow Trim Co. and Cedar Hollow Trim Co.');
  });

  test('a line ending in a separator because its last value is empty loses the separator', () => {
    expect(fillPlaceholders('Sam\n{firm} · {firm_phone}', { firm: 'Birch Row', firm_phone: '' })).toBe('Sam\nBirch Row');
    expect(fillPlaceholders('{firm} · {firm_phone}', { firm: 'Birch Row', firm_phone: '+1 512 555 0147' })).toBe('Birch Row · +1 512 555 0147');
  });

  test('a value is inserted as it is, never read as another placeholder', () => {
    expect(fillPlaceholders('Hi {name}', { name: '{firm}', firm: 'X' })).toBe('Hi {firm}');
  });

  test('unknown words in braces are named once each', () => {
    expect(unknownPlaceholders('Hi {nmae}, {name} {nmae} {link}')).toEqual(['nmae', 'link']);
    expect(unknownPlaceholders('Price {range} for {reference}')).toEqual([]);
    // Braces around anything but a lowercase word are plain text.
    expect(unknownPlaceholders('{ not one } {Name}')).toEqual([]);
  });
});
