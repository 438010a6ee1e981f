import { fc } from '@fast-check/vitest';
import { describe, expect, it } from 'vitest';
import { estimate, parseRateBook, sampleRateBook, type ProjectInput } from '~/lib/estimate';
import { apportionToStep } from '~/lib/estimate/money';
import { presentForHomeowner } from '~/lib/server/estimates/present-estimate';

const baseBook = parseRateBook(sampleRateBook());
// The treatments a homeowner can pick; damp rooms bring in the moisture-resistant one the firm swaps in.
const treatments = baseBook.catalogue.treatments.filter((t) => t.enabled).map((t) => t.id);

describe('rounded breakdown lines add up exactly (largest remainder)', () => {
  it('gives the leftover step to the largest remainder', () => {
    // Source: docs/sources.md §53 (largest-remainder method), worked example computed here:
    // 1,234 + 5,678 + 910 = 7,822, rounded to 100 is 7,800; floors 1,200 + 5,600 + 900 = 7,700,
    // so the one spare 100 goes to the largest remainder (78 of 5,678).
    expect(apportionToStep([1234, 5678, 910], 100)).toEqual({ parts: [1200, 5700, 900], totalCents: 7800 });
  });

  it('rounds the total to the nearest step, half up, as the parts are', () => {
    // Source: docs/sources.md §53, computed here: 50 + 50 = 100 is one step; both parts are half a step,
    // so the tie goes to the first. 149 + 0 + 1 = 150 rounds half up to 200, and the spare step goes to 149.
    expect(apportionToStep([50, 50], 100)).toEqual({ parts: [100, 0], totalCents: 100 });
    expect(apportionToStep([149, 0, 1], 100)).toEqual({ parts: [200, 0, 0], totalCents: 200 });
  });
});

describe("the homeowner's breakdown sums to the middle of the range", () => {
  const room = fc.record({
    length: fc.integer({ min: 36, max: 240 }),
    width: fc.integer({ min: 36, max: 240 }),
    walls: fc.integer({ min: 1, max: 4 }),
    ceiling: fc.integer({ min: 84, max: 132 }),
    treatment: fc.constantFrom(...treatments),
    height: fc.constantFrom('wainscot' as const, 'full' as const),
    outlets: fc.integer({ min: 0, max: 3 }),
    door: fc.boolean(),
    damp: fc.boolean(),
  });
  const project = fc.record({
    rooms: fc.array(room, { minLength: 1, maxLength: 3 }),
    paint: fc.boolean(),
    builtBefore1978: fc.constantFrom('yes' as const, 'no' as const, 'not-sure' as const),
    measuredBy: fc.constantFrom('homeowner-estimate' as const, 'homeowner-tape' as const, 'site-measure' as const),
    photos: fc.integer({ min: 0, max: 2 }),
    // Invented rate-book variations: no minimum, the sample's, a high one that most jobs fall under; steps of $1, $25, $50, $100.
    minimumJobCents: fc.constantFrom(0, baseBook.minimumJobCents, 600_000),
    roundingCents: fc.constantFrom(100, 2500, 5000, 10_000),
    taxOn: fc.constantFrom('materials' as const, 'everything' as const),
  });

  it('for 200 generated projects over the sample treatments, with a total line and the minimum-job line when it applies', () => {
    fc.assert(
      fc.property(project, (p) => {
        const input: ProjectInput = {
          rooms: p.rooms.map((r, i) => ({
            name: `Room ${i + 1}`,
            ceilingHeight: r.ceiling,
            walls: Array.from({ length: r.walls }, (_, w) => ({
              length: w % 2 === 0 ? r.length : r.width,
              outlets: r.outlets,
              openings: w === 0 && r.door && r.length >= 40 ? [{ kind: 'door' as const, width: 30, height: 80 }] : [],
            })),
            treatment: { id: r.treatment, height: r.height },
            damp: r.damp,
          })),
          builtBefore1978: p.builtBefore1978,
          measuredBy: p.measuredBy,
          paint: p.paint,
          photoCount: p.photos,
        };
        const rateBook = { ...baseBook, minimumJobCents: p.minimumJobCents, roundingCents: p.roundingCents, taxOn: p.taxOn };
        const result = estimate(input, rateBook);
        const view = presentForHomeowner(result);
        const step = p.roundingCents;
        // The middle of the range, rounded to the range's step (docs/sources.md §53).
        const middle = Math.round(result.price.totalCents / step) * step;
        expect(view.middleCents).toBe(middle);
        expect(view.groups.reduce((s, g) => s + g.cents, 0)).toBe(view.middleCents);
        for (const g of view.groups) {
          expect(g.cents % step).toBe(0);
          expect(g.cents).toBeGreaterThan(0);
        }
        const rawMinimum = result.price.totalCents - result.price.subtotalCents;
        const minimumLine = view.groups.find((g) => g.id === 'minimum');
        if (!result.price.minimumApplied) expect(minimumLine).toBeUndefined();
        // A minimum-job top-up of at least a whole step always shows.
        if (rawMinimum >= step) expect(minimumLine).toBeDefined();
      }),
      { seed: 20261203, numRuns: 200 },
    );
  });
});
