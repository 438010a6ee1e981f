import { describe, expect, it } from 'vitest';
import { distance } from 'zipcodes';
import { EARTH_RADIUS_MILES, milesBetween, postcodeCentroid } from './postcode-centroids';

describe('great-circle miles between centroids', () => {
  it('matches the worked example of the haversine formula', () => {
    // Nashville BNA (36.12° N, 86.67° W) to Los Angeles LAX (33.94° N, 118.40° W): about 2,886 km,
    // 1,793 statute miles. Source: Wikipedia, "Haversine formula" / "Great-circle distance" worked example (from memory).
    const miles = milesBetween({ latitude: 36.12, longitude: -86.67 }, { latitude: 33.94, longitude: -118.4 });
    expect(miles * 1.609344).toBeCloseTo(2886, -1);
    // A quarter of the way round the equator is πR/2.
    expect(milesBetween({ latitude: 0, longitude: 0 }, { latitude: 0, longitude: 90 })).toBeCloseTo((Math.PI * EARTH_RADIUS_MILES) / 2, 6);
  });

  it('agrees with the zipcodes package’s own distance (whole miles) for ZIP codes near and far', () => {
    // Source: zipcodes 8.0.0 `distance`, a reference implementation over the same centroids.
    for (const [a, b] of [
      ['78701', '78759'],
      ['78701', '78666'],
      ['02134', '10001'],
      ['78701', '10001'],
    ] as const) {
      const ours = milesBetween(postcodeCentroid(a)!, postcodeCentroid(b)!);
      expect(Math.abs(ours - distance(a, b)!), `${a}–${b}`).toBeLessThan(0.02 * ours + 1.5);
    }
  });

  it('reads a ZIP+4 by its first five digits and knows no made-up code', () => {
    expect(postcodeCentroid('78701-1234')).toEqual(postcodeCentroid('78701'));
    expect(postcodeCentroid('00000')).toBeNull();
    expect(postcodeCentroid('787')).toBeNull();
  });
});
