import { describe, expect, it } from 'vitest';
import { INK, WHITE, contrastRatio, relativeLuminance, textOn } from './contrast';

describe('relative luminance and contrast ratio', () => {
  it('gives the end points of the scale', () => {
    // Source: W3C, WCAG 2.2, definition "contrast ratio": ratios range from 1 to 21 (commonly written 1:1 to 21:1).
    expect(contrastRatio('#FFFFFF', '#ffffff')).toBe(1);
    expect(contrastRatio('#000000', '#FFFFFF')).toBeCloseTo(21, 10);
    expect(relativeLuminance('#000000')).toBe(0);
    expect(relativeLuminance('#FFFFFF')).toBeCloseTo(1, 12);
  });

  it('matches published pairs', () => {
    // Source: W3C, WCAG 2.2 Understanding SC 1.4.3: #767676 on white is about 4.54:1, the lightest grey passing AA (from memory).
    expect(contrastRatio('#767676', '#FFFFFF')).toBeCloseTo(4.54, 2);
    // Source: the same definition applied to pure red on white: 3.998:1, just under 4:1 (from memory).
    expect(contrastRatio('#FF0000', '#FFFFFF')).toBeCloseTo(4.0, 2);
  });

  it('does not depend on the order of the colours', () => {
    expect(contrastRatio('#7A4E2D', '#FFFFFF')).toBe(contrastRatio('#FFFFFF', '#7A4E2D'));
  });
});

describe('text on a brand colour', () => {
  it('is ink on light colours and white on dark ones, each at least 4.5:1 here', () => {
    // Source: WCAG 2.2 SC 1.4.3, 4.5:1 for normal text at level AA.
    for (const [brand, text] of [
      ['#FFFFFF', INK],
      ['#F4D35E', INK],
      ['#A8DADC', INK],
      ['#7A4E2D', WHITE],
      ['#1D4E89', WHITE],
      ['#000000', WHITE],
    ] as const) {
      expect(textOn(brand), brand).toBe(text);
      expect(contrastRatio(textOn(brand), brand), brand).toBeGreaterThanOrEqual(4.5);
    }
  });

  it('falls back to ink for something that is not #RRGGBB', () => {
    expect(textOn('red')).toBe(INK);
  });
});
