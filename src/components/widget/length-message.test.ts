import { describe, expect, it } from 'vitest';
import { lengthMessageInUnits } from './length-message.ts';

describe('lengthMessageInUnits: limits in the homeowner units', () => {
  // Source: 1 ft = 12 in, 1 in = 25.4 mm exactly (NIST SP 811 Appendix B, docs/sources.md §13):
  // 1200 in = 100 ft = 30.48 m; 24 in = 2 ft = 609.6 mm; 18 in = 1 ft 6 in.
  it.each([
    ['Room length must be at most 1200 in.', 'imperial', 'Room length must be at most 100 ft.'],
    ['Room width must be at least 24 in.', 'imperial', 'Room width must be at least 2 ft.'],
    ['Wainscot height must be at least 18 in.', 'imperial', 'Wainscot height must be at least 1 ft 6 in.'],
    ['Casing width must be at most 12 in.', 'imperial', 'Casing width must be at most 1 ft.'],
    ['Sheet thickness must be at least 0.0625 in.', 'imperial', 'Sheet thickness must be at least 1/16 in.'],
    ['Room length must be at most 1200 in.', 'metric', 'Room length must be at most 30.48 m.'],
    ['Ceiling height must be at least 60 in.', 'metric', 'Ceiling height must be at least 1.524 m.'],
    ['Wainscot height must be at least 18 in.', 'metric', 'Wainscot height must be at least 458 mm.'],
    ['Opening width must be at most 240 in.', 'metric', 'Opening width must be at most 6.096 m.'],
  ] as const)('%s (%s) → %s', (message, units, expected) => {
    expect(lengthMessageInUnits(message, units)).toBe(expected);
  });

  it('leaves other messages as they are', () => {
    expect(lengthMessageInUnits('Add at least one wall to cover.', 'imperial')).toBe('Add at least one wall to cover.');
    expect(lengthMessageInUnits('At most 16 openings per wall.', 'metric')).toBe('At most 16 openings per wall.');
  });

  // A rounded limit must never invite a value the core refuses: "at least" rounds up, "at most" rounds down.
  it('rounds a metric limit towards the allowed side', () => {
    expect(lengthMessageInUnits('Room width must be at least 24 in.', 'metric')).toBe('Room width must be at least 610 mm.');
    expect(lengthMessageInUnits('Fixture width must be at most 6.01 in.', 'metric')).toBe('Fixture width must be at most 152 mm.');
  });
});
