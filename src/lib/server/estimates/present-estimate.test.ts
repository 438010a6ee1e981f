import { describe, expect, it } from 'vitest';
import { estimate, sampleRateBook } from '~/lib/estimate';
import { presentForHomeowner } from './present-estimate';

describe('the homeowner view of a job under the minimum', () => {
  it('shows a minimum-job group, so the groups add up to the middle of the range', () => {
    const rb = { ...sampleRateBook(), minimumJobCents: 500_000 };
    const result = estimate(
      {
        rooms: [{ name: 'Powder room', ceilingHeight: 96, walls: [{ length: 60 }], treatment: { id: 'beadboard', height: 'wainscot' } }],
        builtBefore1978: 'no',
        measuredBy: 'homeowner-tape',
      },
      rb,
    );
    const view = presentForHomeowner(result);
    expect(view.groups.map((g) => g.id)).toContain('minimum');
    expect(view.groups.reduce((s, g) => s + g.cents, 0)).toBe(result.price.totalCents);
    expect(result.price.totalCents).toBe(500_000);
  });
});
