import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { estimate } from './estimate.ts';
import { fieldsOf } from './input-refusal.testing.ts';
import { sampleRateBook } from './sample-data.ts';
import type { ProjectInput, RateBookInput } from './schemas.ts';
import { describeVisits, siteVisits } from './site-visits.ts';
import { parseRateBook } from './validate.ts';

/** The demo rate book with flat-panel wainscot primed (raw MDF backing), as the dining-room job is priced. */
function rates(change: (rb: RateBookInput) => void = () => {}): RateBookInput {
  const rb = sampleRateBook();
  const flat = rb.catalogue.treatments.find((t) => t.id === 'flat-panel')!;
  flat.needsPrimer = true;
  change(rb);
  return rb;
}

const diningRoom = (paint = true): ProjectInput => ({
  rooms: [
    {
      name: 'Dining room',
      ceilingHeight: 96,
      length: 168,
      width: 144,
      walls: [
        { side: 'length', outlets: 2 },
        { side: 'width', openings: [{ kind: 'door', width: 36, height: 80, offset: 54 }], outlets: 1 },
        { side: 'length', outlets: 2 },
        { side: 'width', outlets: 1 },
      ],
      treatment: { id: 'flat-panel', height: 'wainscot', wainscotHeight: 36 },
      replaceBaseboard: true,
    },
  ],
  paint,
  builtBefore1978: 'no',
  measuredBy: 'site-measure',
  photoCount: 0,
});

describe('a 12 × 14 ft dining room in flat-panel wainscot, primed once and painted twice', () => {
  // Hand-worked, demo rate book (invented demo rates; the rules are docs/sources.md §26–§27):
  // Band: top of the 5-1/4 in baseboard to the 36 in cap = 30.75 in.
  //   Walls 168 + 144 + 168 + 144 = 624 in × 30.75 in ÷ 144 = 133.25 sq ft, less the 36 in door and its
  //   2-1/4 in casing on both sides (docs/sources.md §30), 40.5 in across the band: 40.5 × 30.75 ÷ 144 = 8.6484375
  //   → 124.6015625 sq ft of panelling. Cap rail and new baseboard stop at the casing: 624 − 40.5 = 583.5 in
  //   = 48.625 ft; cap rail at 1.5 in = 6.078125 sq ft, baseboard at 5.25 in = 21.2734375 sq ft.
  //   Painted area 124.6015625 + 6.078125 + 21.2734375 = 151.953125 sq ft.
  // Painting (flat panel, factor 1; 80 sq ft per hour per coat):
  //   prime 151.953125 × 1 ÷ 80 = 1.899 h; paint 151.953125 × 2 ÷ 80 = 3.799 h.
  // Install, trim and cut-outs: 124.6016 ÷ 10 = 12.460 + 6 cut-outs × 0.25 = 1.5 + 1 return × 0.5
  //   + 4 corners × 0.2 = 0.8 + 48.625 ft × (0.02 + 0.05 + 0.06) = 6.321 → 21.58 h ÷ 8 h per day = 2.7 → 3 install days.
  // Visits: 3 install + 1 caulk and fill + 1 primer coat + 2 paint coats = 7; set-up 7 × 1 h = 7 h
  //   (the old per-room rule charged 1 h for the one room).
  // Containers: primer 151.953 ÷ 400 = 0.380 gal → 2 quarts $28 (a gallon is $35);
  //   paint 151.953 × 2 ÷ 350 = 0.868 gal → 4 quarts $72 or 1 gallon $52 → 1 gallon.
  const e = estimate(diningRoom(), parseRateBook(rates()));
  const line = (label: string) => e.price.labour.find((l) => l.label === label)!;

  it('prices each coating per coat', () => {
    expect(e.takeoff.paintSqFt).toBeCloseTo(151.953125, 6);
    expect(line('Prime (1 coat)').hours).toBeCloseTo(1.9, 2);
    expect(line('Paint (2 coats)').hours).toBeCloseTo(3.8, 2);
    expect(line('Paint (2 coats)').basis).toBe('152 sq ft × 2 coats ÷ 80 sq ft per hour per coat');
  });

  it('counts the visits and charges set-up on each', () => {
    expect(e.price.visits).toEqual({ total: 7, installDays: 3, caulkAndFill: 1, primerCoats: 1, paintCoats: 2, setupHoursEach: 1 });
    expect(line('Set-up and clean-up').hours).toBe(7);
    expect(line('Set-up and clean-up').basis).toBe('7 visits × 1 h (7 visits: 3 install days, 1 to caulk and fill, 1 primer coat, 2 paint coats)');
  });

  it('buys primer and paint in the cheapest containers', () => {
    const primer = e.takeoff.materials.find((m) => m.id === 'primer')!;
    const paint = e.takeoff.materials.find((m) => m.id === 'paint')!;
    expect(primer.packs).toEqual([{ name: 'quart', gallons: 0.25, priceCents: 1400, count: 2 }]);
    expect(primer.quantity * primer.unitCents).toBe(2800);
    expect(paint.packs).toEqual([{ name: 'gallon', gallons: 1, priceCents: 5200, count: 1 }]);
    expect(paint.basis).toContain('1 gallon (1 gal)');
  });

  it('without painting: install days only, no coats, no caulk-and-fill visit', () => {
    const bare = estimate(diningRoom(false), parseRateBook(rates()));
    expect(bare.price.visits).toEqual({ total: 3, installDays: 3, caulkAndFill: 0, primerCoats: 0, paintCoats: 0, setupHoursEach: 1 });
    expect(bare.price.labour.some((l) => l.task === 'paint')).toBe(false);
  });

  it('shows litres to a metric firm', () => {
    const metric = estimate(diningRoom(), parseRateBook(rates((rb) => void (rb.units = 'metric'))));
    // Source: NIST Handbook 44 Appendix C — 1 US gal = 3.785411784 L; 0.8683 gal = 3.29 L, 1 gal = 3.79 L.
    expect(metric.takeoff.materials.find((m) => m.id === 'paint')!.basis).toMatch(/= 3\.29 L; .*1 gallon \(3\.79 L\)$/);
  });
});

describe('rate books from before coats, visits and containers', () => {
  const old = (): RateBookInput => {
    const rb = rates();
    const labour = rb.labour as Record<string, unknown>;
    delete labour.setupHoursPerVisit;
    delete labour.hoursPerDay;
    labour.setupHoursPerRoom = 1.5;
    delete rb.catalogue.supplies.primer.containers;
    delete rb.catalogue.supplies.paint.containers;
    for (const t of rb.catalogue.treatments) delete t.paintFactor;
    return rb;
  };

  it('still parse; the per-room set-up stands in per visit, and paint is bought in whole gallons', () => {
    const e = estimate(diningRoom(), parseRateBook(old()));
    // 7 visits as above (8 h days by default) × 1.5 h = 10.5 h.
    expect(e.price.visits?.setupHoursEach).toBe(1.5);
    expect(e.price.labour.find((l) => l.task === 'setup')!.hours).toBe(10.5);
    const paint = e.takeoff.materials.find((m) => m.id === 'paint')!;
    expect([paint.quantity, paint.unit, paint.unitCents, paint.packs]).toEqual([1, 'gallon', 5200, undefined]);
  });

  it('a rate book with no set-up figure at all is refused on the field', () => {
    const rb = old();
    delete (rb.labour as Record<string, unknown>).setupHoursPerRoom;
    expect(fieldsOf(() => estimate(diningRoom(), rb))['rateBook.labour.setupHoursPerVisit']).toMatch(/per visit is required/);
  });
});

describe('painting factor and install days', () => {
  it('grooved faces paint slower by their factor', () => {
    const project = (id: string): ProjectInput => ({
      ...diningRoom(),
      rooms: [{ ...diningRoom().rooms[0]!, treatment: { id, height: 'wainscot', wainscotHeight: 36 } }],
    });
    const rb = parseRateBook(rates());
    const bead = estimate(project('beadboard'), rb);
    const paint = bead.price.labour.find((l) => l.label === 'Paint (2 coats)')!;
    // Demo beadboard factor 1.5 (common practice, no source): hours = area × 1.5 × 2 ÷ 80.
    expect(paint.hours).toBeCloseTo((bead.takeoff.paintSqFt * 1.5 * 2) / 80, 2);
    expect(paint.basis).toContain('beadboard wainscot × 1.5');
  });

  // common practice, no source: a day is the rate book's working hours; a part day is a visit.
  it('rounds install hours up to whole days', () => {
    const v = (h: number) => siteVisits({ installHours: h, hoursPerDay: 8, painting: true, primerCoats: 1, paintCoats: 2, setupHoursEach: 1 });
    expect(v(8).installDays).toBe(1);
    expect(v(8.01).installDays).toBe(2);
    expect(v(0).total).toBe(4);
    expect(describeVisits(v(16))).toBe('6 visits: 2 install days, 1 to caulk and fill, 1 primer coat, 2 paint coats');
  });

  it('more wall never means fewer visits or less set-up', () => {
    const rb = parseRateBook({ ...rates(), minimumJobCents: 0 });
    fc.assert(
      fc.property(
        fc.integer({ min: 60, max: 600 }),
        fc.integer({ min: 1, max: 240 }),
        fc.boolean(),
        fc.constantFrom('flat-panel', 'beadboard', 'shiplap-horizontal'),
        (length, more, paint, id) => {
          const p = (l: number): ProjectInput => ({
            ...diningRoom(paint),
            rooms: [{ name: 'Room', ceilingHeight: 96, walls: [{ length: l, outlets: 1 }], treatment: { id, height: 'full' } }],
          });
          const a = estimate(p(length), rb).price;
          const b = estimate(p(length + more), rb).price;
          expect(b.visits!.total).toBeGreaterThanOrEqual(a.visits!.total);
          expect(b.totalCents).toBeGreaterThanOrEqual(a.totalCents);
        },
      ),
      { seed: 20261202, numRuns: 100 },
    );
  });
});
