import { describe, expect, it } from 'vitest';
import { parseRateBook, sampleRateBook, takeoff, type ProjectInput } from './index.ts';
import { bradFor, PANEL_PENETRATION, TRIM_PENETRATION } from './brad-sizes.ts';

const sizes = [
  { name: '2 in', length: 2, perBox: 1000, priceCents: 900 },
  { name: '1 in', length: 1, perBox: 1000, priceCents: 700 },
  { name: '1-1/4 in', length: 1.25, perBox: 1000, priceCents: 750 },
];

const job: ProjectInput = {
  rooms: [{ name: 'Den', ceilingHeight: 96, walls: [{ length: 144 }], treatment: { id: 'board-and-batten', height: 'wainscot', wainscotHeight: 40 } }],
  builtBefore1978: 'no',
  measuredBy: 'site-measure',
};

describe('brads in the size each fixing needs', () => {
  it('picks the shortest listed brad at least thickness + hold long', () => {
    // Source: docs/sources.md §46 (common practice, no source): 1/4 in panel + 3/4 in hold = 1 in;
    // 3/4 in trim (PS 20 1-by, docs/sources.md §1) + 1-1/4 in hold = 2 in.
    expect(bradFor(sizes, 0.25, PANEL_PENETRATION)?.name).toBe('1 in');
    expect(bradFor(sizes, 0.75, TRIM_PENETRATION)?.name).toBe('2 in');
    // 1/2 in panel needs 1-1/4 in; 1-1/8 in cap rail needs 2-3/8 in: none listed.
    expect(bradFor(sizes, 0.5, PANEL_PENETRATION)?.name).toBe('1-1/4 in');
    expect(bradFor(sizes, 1.125, TRIM_PENETRATION)).toBeUndefined();
  });

  it('a 12 ft board-and-batten wainscot: one line per size, with its basis', () => {
    // Realistic job, worked by hand (demo rates: 2.5 brads per sq ft, 1.5 per foot of trim; invented):
    // Band 5.25 → 40 in = 34.75 in; 144 × 34.75 / 144 = 34.75 sq ft of 1/4 in MDF backing × 2.5 = 86.9
    // → 87 brads, 1/4 + 3/4 = 1 in long. Battens: ceil((144 − 2.5) / 16) + 1 = 10, each 40 − 3.5 (1x4
    // top rail) − 5.25 = 31.25 in: 312.5 in = 26.04 ft, plus the 12 ft top rail = 38.04 ft × 1.5 = 57.1
    // → 58 brads, 3/4 + 1-1/4 = 2 in. Cap rail 12 ft × 1.5 = 18, 1-1/8 + 1-1/4 = 2-3/8 in: the 2-1/2 in nail.
    // The old baseboard is reset on the new work (12 ft × 1.5 = 18 more 2 in brads, build-up.ts).
    const t = takeoff(job, parseRateBook(sampleRateBook()).catalogue);
    const brads = t.materials.filter((m) => m.id.startsWith('brads'));
    expect(brads.map((m) => [m.id, m.quantity])).toEqual([
      ['brads@1', 1],
      ['brads@2', 1],
      ['brads@2.5', 1],
    ]);
    expect(brads[0]!.basis).toMatch(/^87 for wall covering 1\/4" \+ 3\/4" hold = 1"/);
    expect(brads[1]!.basis).toMatch(/^58 for trim 3\/4" \+ 1-1\/4" hold = 2"/);
    expect(brads[2]!.basis).toMatch(/^18 for cap rail 1-1\/8" \+ 1-1\/4" hold = 2-3\/8"/);
  });

  it('without a list, the single brad prices everything as before', () => {
    // Computed here: 86.875 + 38.04 × 1.5 + 12 × 1.5 (cap rail) + 12 × 1.5 (the old baseboard reset on the
    // 1 in of new work, build-up.ts) = 179.9 brads → 180, one box of 1000.
    const rb = sampleRateBook();
    delete (rb.catalogue.supplies.brads as { sizes?: unknown }).sizes;
    const t = takeoff(job, parseRateBook(rb).catalogue);
    const brads = t.materials.filter((m) => m.id.startsWith('brads'));
    expect(brads).toHaveLength(1);
    expect(brads[0]).toMatchObject({ id: 'brads', quantity: 1, unitCents: 900 });
    expect(brads[0]!.basis).toMatch(/= 180 brads, 1000 per box/);
  });

  it('a fixing no listed brad is long enough for takes the single brad', () => {
    const rb = sampleRateBook();
    rb.catalogue.supplies.brads.sizes = sizes;
    const t = takeoff(job, parseRateBook(rb).catalogue);
    const fallback = t.materials.find((m) => m.id === 'brads')!;
    expect(fallback.basis).toMatch(/^18 for cap rail .*no listed brad is long enough/);
  });
});
