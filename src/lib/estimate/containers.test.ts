import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { cheapestContainers, describePacks, LITRES_PER_US_GALLON, type Container } from './containers.ts';

const quart = { name: 'quart', gallons: 0.25, priceCents: 1800 };
const gallon = { name: 'gallon', gallons: 1, priceCents: 4500 };
const pail = { name: '5-gallon pail', gallons: 5, priceCents: 19000 };

describe('cheapest containers that cover the gallons needed', () => {
  // Hand-worked (prices invented for the example): 1.3 gal needed is 5.2 quarts, so at least 6 quarts' worth.
  //   6 quarts                = 6 × $18           = $108
  //   1 gallon + 1 quart      = 1.25 gal          — does not cover 1.3
  //   1 gallon + 2 quarts     = $45 + 2 × $18     = $81   ← cheapest
  //   2 gallons               = 2 × $45           = $90
  //   1 five-gallon pail      = $190
  it('buys 1 gallon + 2 quarts for 1.3 gallons', () => {
    const c = cheapestContainers(1.3, [quart, gallon, pail]);
    expect(describePacks(c.packs)).toBe('1 gallon + 2 quarts');
    expect(c.totalCents).toBe(8100);
    expect(c.gallons).toBe(1.5);
  });

  // Hand-worked: 4.2 gal. 4 gallons + 1 quart = 4.25 gal = $180 + $18 = $198; 1 pail = $190; 5 gallons = $225.
  it('buys a pail when it is cheaper than the gallons and quarts it replaces', () => {
    expect(describePacks(cheapestContainers(4.2, [quart, gallon, pail]).packs)).toBe('1 5-gallon pail');
  });

  // With only the one-gallon price (an older rate book) the answer is whole gallons, as before.
  it('with one-gallon containers only, buys ceil(gallons)', () => {
    // Source: docs/sources.md §7 — 349 sq ft, two coats at 350 sq ft/gal is 1.99 gal, so 2 gallons.
    expect(cheapestContainers((349 * 2) / 350, [gallon]).packs).toEqual([{ ...gallon, count: 2 }]);
    expect(cheapestContainers(0, [gallon]).packs).toEqual([]);
  });

  it('stays exact and small for a very large job (the bulk is bought in the best-value size)', () => {
    const c = cheapestContainers(1234.3, [quart, gallon, pail]);
    // 246 pails = 1230 gal; 4.3 more: 1 pail ($190) beats 4 gallons + 2 quarts ($216), so 247 pails.
    expect(c.packs).toEqual([{ ...pail, count: 247 }]);
  });

  // Source: NIST Handbook 44 Appendix C — 1 US gallon = 231 in³ = 3.785411784 L exactly (231 × 2.54³ / 1000).
  it('litres per US gallon follow from 231 in³ and 2.54 cm per inch', () => {
    expect(LITRES_PER_US_GALLON).toBeCloseTo((231 * 2.54 ** 3) / 1000, 12);
  });

  // Brute force: every count of each container up to what could ever be useful.
  const bruteForce = (need: number, cs: Container[]): number => {
    let best = Infinity;
    const limit = cs.map((c) => Math.ceil(need / c.gallons - 1e-9));
    const walk = (i: number, gallons: number, cents: number): void => {
      if (i === cs.length) {
        if (gallons >= need - 1e-9) best = Math.min(best, cents);
        return;
      }
      for (let n = 0; n <= limit[i]!; n++) walk(i + 1, gallons + n * cs[i]!.gallons, cents + n * cs[i]!.priceCents);
    };
    walk(0, 0, 0);
    return best;
  };
  const size = fc.constantFrom(0.25, 0.5, 1, 2, 2.5, 5);
  const container = fc.record({ name: fc.constant('can'), gallons: size, priceCents: fc.integer({ min: 100, max: 30000 }) });
  it('costs what brute-force enumeration finds, and covers the need', () => {
    fc.assert(
      fc.property(fc.array(container, { minLength: 1, maxLength: 3 }), fc.integer({ min: 1, max: 60 }), (cs, tenths) => {
        const need = tenths / 10;
        const c = cheapestContainers(need, cs);
        expect(c.totalCents).toBe(bruteForce(need, cs));
        expect(c.gallons).toBeGreaterThanOrEqual(need - 1e-9);
      }),
      { seed: 20261202, numRuns: 100 },
    );
  });

  it('never costs less for more paint', () => {
    fc.assert(
      fc.property(fc.array(container, { minLength: 1, maxLength: 3 }), fc.integer({ min: 1, max: 200 }), fc.integer({ min: 1, max: 50 }), (cs, a, more) => {
        expect(cheapestContainers((a + more) / 10, cs).totalCents).toBeGreaterThanOrEqual(cheapestContainers(a / 10, cs).totalCents);
      }),
      { seed: 20261202, numRuns: 100 },
    );
  });
});
