import { describe, expect, it } from 'vitest';
import { beadFeetPerTube, caulkFeetPerTube, filletFeetPerTube, gallonsToBuy, theoreticalCoverage } from './coverage.ts';

describe('paint and primer', () => {
  // Source: PPG PROMASTER Eggshell Interior Wall and Trim Enamel technical data sheet — 37 % volume solids, theoretical 593 sq ft/gal at 1 mil dry (docs/sources.md §7).
  it('theoretical coverage of 37 % solids at 1 mil is 593.5 sq ft per gallon', () => {
    expect(theoreticalCoverage(0.37, 1)).toBeCloseTo(593.5, 1);
    // Source: NIST SP 811 — 1 US gal = 231 in³ exactly: 231 / 0.001 / 144 = 1604.2 sq ft at 1 mil.
    expect(theoreticalCoverage(1, 1)).toBeCloseTo(1604.17, 2);
  });

  // Source: docs/sources.md §7 worked example with PPG's practical 300–400 sq ft/gal and Glidden Stain Block Primer's ~400 sq ft/gal —
  // a 12 × 12 ft room, 8 ft walls: 384 − 20 (door) − 15 (window) = 349 sq ft; 2 coats → 2 gallons at 350 and at 400.
  it('buys 2 gallons for two coats over 349 sq ft', () => {
    expect(gallonsToBuy(349, 2, 350)).toBe(2);
    expect(gallonsToBuy(349, 2, 400)).toBe(2);
    expect(gallonsToBuy(400, 1, 400)).toBe(1);
    expect(gallonsToBuy(401, 1, 400)).toBe(2);
  });
});

describe('caulk and adhesive', () => {
  // Source: docs/sources.md §7 — 10.1 fl oz = 18.227 in³ (NIST: 1 US fl oz = 1.8046875 in³); 1/4 × 1/4 in joint → 24.3 ft,
  // 1/4 in triangular fillet → 48.6 ft. No manufacturer chart found; arithmetic check on the volume.
  it('a 10.1 fl oz tube runs 24.3 ft of 1/4 × 1/4 in joint and 48.6 ft of 1/4 in fillet', () => {
    expect(caulkFeetPerTube(10.1, 0.25, 0.25)).toBeCloseTo(24.3, 1);
    expect(filletFeetPerTube(10.1, 0.25)).toBeCloseTo(48.61, 2);
  });

  // Source: docs/sources.md §7 — 10 fl oz adhesive: 1/4 in round bead ≈ 30.6 ft, 3/8 in ≈ 13.6 ft (volume arithmetic; Loctite PL Premium TDS gives the tube size).
  it('a 10 fl oz adhesive tube lays 30.6 ft of 1/4 in bead', () => {
    expect(beadFeetPerTube(10, 0.25)).toBeCloseTo(30.6, 1);
    expect(beadFeetPerTube(10, 0.375)).toBeCloseTo(13.6, 1);
  });
});
