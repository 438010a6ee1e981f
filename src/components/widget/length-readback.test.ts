import { describe, expect, it } from 'vitest';
import { inchesOrFeet, readBack } from './length-readback.ts';

describe('readBack: how a typed length was read', () => {
  // Source: 1 ft = 12 in and 1 in = 25.4 mm exactly (NIST SP 811 Appendix B, docs/sources.md §13);
  // the issue's own example "= 5' 0"" for a 5 ft wall.
  it.each([
    ['5 ft', `= 5' 0"`],
    ['60', `= 5' 0"`],
    ['7 1/2 ft', `= 7' 6"`],
    [`3' 3-1/2"`, `= 3' 3-1/2"`],
    ['36"', `= 3' 0"`],
    ['9 1/2', `= 9-1/2"`],
  ])('imperial %j reads back as %j', (text, shown) => {
    expect(readBack(text, 'imperial')).toEqual({ state: 'read', text: shown, inches: expect.any(Number) });
  });

  // Source: 1 m = 1000 mm (SI, NIST SP 811 §4); decimal comma per ISO 80000-1 §7.3.2 (docs/sources.md §13).
  it.each([
    ['2440', '= 2.44 m'],
    ['244 cm', '= 2.44 m'],
    ['2,44 m', '= 2.44 m'],
    ['900 mm', '= 900 mm'],
    ['8,5 m', '= 8.5 m'],
  ])('metric %j reads back as %j', (text, shown) => {
    expect(readBack(text, 'metric')).toMatchObject({ state: 'read', text: shown });
  });

  it('says nothing for an empty field', () => {
    expect(readBack('   ', 'imperial')).toEqual({ state: 'empty' });
  });

  it('passes on what to type when the text is not a length', () => {
    const result = readBack('twelve', 'imperial');
    expect(result.state).toBe('unreadable');
    expect(result.state === 'unreadable' && result.message).toMatch(/Expected a length like/);
  });
});

describe('inchesOrFeet: ask when a bare number is implausible as inches', () => {
  // Plausible ranges per field kind are common practice, no source (rooms 3–60 ft, ceilings 7–20 ft).
  it('asks about a room length of 12 (12 in is no room; 12 ft is)', () => {
    expect(inchesOrFeet('12', 'imperial', 'room-length')).toEqual({
      small: { label: '12 in', text: '12 in' },
      large: { label: '12 ft', text: '12 ft' },
    });
  });

  it('asks about a ceiling height of 8', () => {
    expect(inchesOrFeet('8', 'imperial', 'ceiling-height')).toMatchObject({ large: { label: '8 ft' } });
  });

  it('asks about a wall of 7 1/2', () => {
    expect(inchesOrFeet('7 1/2', 'imperial', 'wall-length')).toMatchObject({ small: { text: '7 1/2 in' }, large: { text: '7 1/2 ft' } });
  });

  it.each([
    ['144', 'room-length'],
    ['96', 'ceiling-height'],
    ['36', 'wainscot-height'],
    ['12 ft', 'room-length'],
    ['8"', 'ceiling-height'],
    [`12'`, 'room-length'],
    ['', 'room-length'],
    ['abc', 'room-length'],
  ] as const)('does not ask about %j as a %s', (text, kind) => {
    expect(inchesOrFeet(text, 'imperial', kind)).toBeNull();
  });

  it('does not ask when neither reading is plausible (900 as a room length)', () => {
    expect(inchesOrFeet('900', 'imperial', 'room-length')).toBeNull();
  });

  it('asks a metric firm millimetres or metres for a bare 4 as a room length', () => {
    expect(inchesOrFeet('4', 'metric', 'room-length')).toEqual({
      small: { label: '4 mm', text: '4 mm' },
      large: { label: '4 m', text: '4 m' },
    });
    expect(inchesOrFeet('2,4', 'metric', 'ceiling-height')).toMatchObject({ large: { text: '2,4 m' } });
    expect(inchesOrFeet('4300', 'metric', 'room-length')).toBeNull();
  });

  it('never asks for a plain length with no kind-specific range', () => {
    expect(inchesOrFeet('3', 'imperial', 'length')).toBeNull();
  });
});
