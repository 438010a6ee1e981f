/** The range around a job under the firm's minimum. */
import { describe, expect, it } from 'vitest';
import { estimate, parseRateBook, sampleRateBook, type ProjectInput } from './index.ts';

const small = (length: number): ProjectInput => ({
  rooms: [{ name: 'Powder room', ceilingHeight: 96, walls: [{ length }], treatment: { id: 'beadboard', height: 'wainscot' } }],
  builtBefore1978: 'no',
  measuredBy: 'homeowner-estimate',
});

describe('the minimum job and the range', () => {
  const base = parseRateBook(sampleRateBook());
  const spread = base.range['homeowner-estimate'].withoutPhotos;
  const step = base.roundingCents;
  // The job's own price, with no minimum in the way.
  const own = (length: number): number => estimate(small(length), { ...base, minimumJobCents: 0 }).price.subtotalCents;

  // The rule (the firm's minimum is a floor, not a price to widen; common practice, no source):
  // low = the minimum; high = the minimum or the job's own upper estimate, whichever is higher;
  // the middle is the minimum, and a "Minimum job" line makes the lines add up to it.
  it('keeps the high end of a job under the minimum at its own upper estimate', () => {
    const subtotal = own(96);
    const rb = { ...base, minimumJobCents: subtotal + 1000 };
    const p = estimate(small(96), rb).price;
    expect(p.minimumApplied).toBe(true);
    expect(p.totalCents).toBe(rb.minimumJobCents);
    expect(p.lowCents).toBe(rb.minimumJobCents);
    expect(p.highCents).toBe(Math.max(rb.minimumJobCents, Math.ceil(Math.ceil(subtotal * (1 + spread.above)) / step) * step));
    const minimum = p.lines.find((l) => l.group === 'minimum')!;
    expect(minimum.label).toBe('Minimum job');
    expect(minimum.totalCents).toBe(rb.minimumJobCents - subtotal);
    expect(p.lines.reduce((s, l) => s + l.totalCents, 0)).toBe(p.totalCents);
  });

  it('shows different ranges for different jobs under the same minimum', () => {
    const rb = { ...base, minimumJobCents: own(120) + 1000 };
    const a = estimate(small(60), rb).price;
    const b = estimate(small(120), rb).price;
    expect(a.minimumApplied && b.minimumApplied).toBe(true);
    expect(b.highCents).toBeGreaterThan(a.highCents);
    expect(a.lowCents).toBe(rb.minimumJobCents);
  });

  it('shows the minimum alone when even the upper estimate is under it', () => {
    const rb = { ...base, minimumJobCents: 10 * own(60) };
    const p = estimate(small(60), rb).price;
    expect([p.lowCents, p.highCents]).toEqual([rb.minimumJobCents, rb.minimumJobCents]);
  });
});
