import { describe, expect, it } from 'vitest';
import { estimate, sampleRateBook } from '~/lib/estimate';
import { presentForHomeowner } from './present-estimate';
import { rangeReason } from './range-reason';

// The spreads are the sample rate book's invented demo values; the percentages are those fractions × 100 (computed here).
describe('the sentence on why the range is as wide as it is', () => {
  it('names the spread and both causes when the sizes are estimates and there are no photos', () => {
    expect(rangeReason('homeowner-estimate', 0, { below: 0.2, above: 0.4 })).toBe(
      'The range runs from 20 % below to 40 % above because the sizes are estimates and there are no photos yet.',
    );
  });

  it('says ± when the spread is the same both ways', () => {
    expect(rangeReason('homeowner-estimate', 0, { below: 0.15, above: 0.15 })).toBe(
      'The range is ±15 % because the sizes are estimates and there are no photos yet.',
    );
  });

  it('credits a tape measure and the photos sent', () => {
    expect(rangeReason('homeowner-tape', 2, { below: 0.1, above: 0.15 })).toBe(
      'The range runs from 10 % below to 15 % above because you measured with a tape and sent photos.',
    );
    expect(rangeReason('homeowner-tape', 1, { below: 0.1, above: 0.1 })).toBe('The range is ±10 % because you measured with a tape and sent a photo.');
  });

  it('keeps a fraction of a percent, and names a site measurement', () => {
    expect(rangeReason('site-measure', 0, { below: 0.025, above: 0.05 })).toBe(
      'The range runs from 2.5 % below to 5 % above because the walls were measured on site and there are no photos yet.',
    );
    expect(rangeReason('site-measure', 3, { below: 0.03, above: 0.05 })).toBe(
      'The range runs from 3 % below to 5 % above because the walls were measured on site and you sent photos.',
    );
  });

  it('is one sentence of the homeowner view, from the rate book the job was priced with', () => {
    const view = presentForHomeowner(
      estimate(
        {
          rooms: [{ name: 'Hall', ceilingHeight: 96, walls: [{ length: 120 }], treatment: { id: 'beadboard', height: 'wainscot' } }],
          builtBefore1978: 'no',
          measuredBy: 'homeowner-estimate',
          photoCount: 1,
        },
        sampleRateBook(),
      ),
    );
    expect(view.rangeReason).toBe('The range runs from 15 % below to 30 % above because the sizes are estimates and you sent a photo.');
    expect(view.rangeReason.match(/\./g)).toHaveLength(1);
  });
});
