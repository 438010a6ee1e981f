import { fc, test as fcTest } from '@fast-check/vitest';
import { describe, expect, it } from 'vitest';
import { formatArea, formatLength, inchesToMm, LengthParseError, mmToInches, parseLength, sqFtToSqM } from './units.ts';

describe('unit conversion', () => {
  // Source: NBS Circular 572 addendum (1960) / NIST SP 811 Appendix B — 1 in = 25.4 mm exactly.
  it('one inch is exactly 25.4 mm', () => {
    expect(inchesToMm(1)).toBe(25.4);
    expect(mmToInches(25.4)).toBe(1);
  });
  // Source: exact from 1 in = 25.4 mm (NIST SP 811): 1 ft = 0.3048 m, 1 ft² = 0.09290304 m²; a 4 × 8 ft sheet is 2.97289728 m² (docs/sources.md §13).
  it('a 4 × 8 ft sheet is 2.97289728 m²', () => {
    expect(inchesToMm(12)).toBeCloseTo(304.8, 12);
    expect(sqFtToSqM(32)).toBeCloseTo(2.97289728, 12);
  });
});

describe('parseLength', () => {
  // Source: the list of what people type from a tape; values by the exact inch definition (NIST).
  it.each([
    ['39 1/2', 39.5],
    ['39-1/2"', 39.5],
    [`3' 3-1/2"`, 39.5],
    [`3'-3 1/2"`, 39.5],
    ['3 ft 3.5 in', 39.5],
    ['39.5', 39.5],
    ['1/2"', 0.5],
    [`8'`, 96],
    ['3 feet', 36],
  ])('reads %s as %d in', (text, inches) => {
    expect(parseLength(text, 'imperial')).toBeCloseTo(inches, 12);
  });

  it.each([
    ['1003 mm', 1003 / 25.4],
    ['100.3 cm', 1003 / 25.4],
    ['1.003 m', 1003 / 25.4],
    ['1003', 1003 / 25.4],
  ])('reads metric %s (Source: 1 in = 25.4 mm, NIST)', (text, inches) => {
    expect(parseLength(text, 'metric')).toBeCloseTo(inches, 9);
  });

  // Source: NIST SP 811 §5.3 / Appendix B for the unit symbols (ft, in, m) and 1 ft = 12 in exactly;
  // the prime (') and double prime (") for feet and inches are US trade usage (common practice, no source).
  it.each([
    ['7 1/2 ft', 90],
    ['7-1/2 ft', 90],
    [`7 1/2'`, 90],
    ['7 ft 6 in', 90],
    [`7' 6"`, 90],
    [`7'6"`, 90],
    ['7 feet 6 inches', 90],
    ['7.5 ft', 90],
  ])('reads feet with a fraction or inches: %s is %d in', (text, inches) => {
    expect(parseLength(text, 'imperial')).toBeCloseTo(inches, 12);
  });

  // Source: ISO 80000-1:2009 §7.3.2 — the decimal sign is a comma or a point on the line (docs/sources.md §13).
  it.each([
    ['8,5 m', 8500 / 25.4],
    ['2,44 m', 2440 / 25.4],
    ['2,4 cm', 24 / 25.4],
    ['0,5 m', 500 / 25.4],
  ])('reads the decimal comma in metric: %s', (text, inches) => {
    expect(parseLength(text, 'metric')).toBeCloseTo(inches, 9);
    expect(parseLength(text, 'imperial')).toBeCloseTo(inches, 9);
  });

  // A comma before exactly three digits stays a thousands separator, as it was read before.
  it('still reads 1,003 mm as one thousand and three millimetres', () => {
    expect(parseLength('1,003 mm', 'metric')).toBeCloseTo(1003 / 25.4, 9);
  });

  it('does not take a comma in an imperial length as a decimal sign', () => {
    expect(() => parseLength('8,5', 'imperial')).toThrow(LengthParseError);
  });

  it('accepts an explicit metric unit from an imperial firm', () => {
    expect(parseLength('254 mm', 'imperial')).toBeCloseTo(10, 12);
  });

  it.each(['abc', '3 3', '', '-4', '1/0', '39 3/2', '4 furlongs'])('refuses %j with a message saying what was expected', (text) => {
    expect(() => parseLength(text, 'imperial')).toThrow(LengthParseError);
    try {
      parseLength(text, 'imperial');
    } catch (e) {
      expect((e as Error).message).toMatch(/Expected|fraction/);
    }
  });

  it('tells a metric firm what metric input looks like', () => {
    expect(() => parseLength('three metres', 'metric')).toThrow(/1003 mm, 100.3 cm or 1.003 m/);
  });
});

describe('formatLength', () => {
  it('writes feet and inches to the nearest 1/16 in', () => {
    expect(formatLength(39.5, 'imperial')).toBe(`3' 3-1/2"`);
    expect(formatLength(39.5, 'imperial', { style: 'inches' })).toBe('39-1/2"');
    expect(formatLength(3.375, 'imperial')).toBe('3-3/8"');
    expect(formatLength(143.99, 'imperial')).toBe(`12'`);
    expect(formatLength(1003 / 25.4, 'metric')).toBe('1003 mm');
    expect(formatLength(1003 / 25.4, 'metric', { metricUnit: 'cm' })).toBe('100.3 cm');
  });

  it('writes areas in the firm units', () => {
    expect(formatArea(32, 'imperial')).toBe('32 sq ft');
    expect(formatArea(32, 'metric')).toBe('3 m²');
  });

  // Property: parse(format(x)) comes back within 1/16 in (imperial) — and within 1/2 mm < 1/16 in (metric).
  fcTest.prop([fc.double({ min: 0.01, max: 2400, noNaN: true })])('round-trips through text to 1/16 in', (x) => {
    expect(Math.abs(parseLength(formatLength(x, 'imperial'), 'imperial') - x)).toBeLessThanOrEqual(1 / 32 + 1e-9);
    expect(Math.abs(parseLength(formatLength(x, 'imperial', { style: 'inches' }), 'imperial') - x)).toBeLessThanOrEqual(1 / 32 + 1e-9);
    expect(Math.abs(parseLength(formatLength(x, 'metric'), 'metric') - x)).toBeLessThanOrEqual(1 / 16);
  });
});
