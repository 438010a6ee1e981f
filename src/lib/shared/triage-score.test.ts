import { describe, expect, test } from 'vitest';
import { DEFAULT_TRIAGE_WEIGHTS, triageWeightsSchema } from '~/lib/estimate/schemas.ts';
import { triageScore, type TriageFacts } from './triage-score';

// The score is our own rule, not a trade standard: these checks hold it to its definition (points
// per reason, scaled to 100 by the weights' sum). common practice, no source.
const strong: TriageFacts = {
  insideServiceArea: true,
  hasServiceArea: true,
  coveredSqFt: 420,
  photoCount: 4,
  measuredBy: 'site-measure',
  firstContactAt: null,
  responseDueAt: new Date('2026-12-04T18:00:00Z'),
  now: new Date('2026-12-04T15:00:00Z'),
};

const points = (facts: TriageFacts) => Object.fromEntries(triageScore(facts, DEFAULT_TRIAGE_WEIGHTS).reasons.map((r) => [r.id, `${r.points}/${r.of}`]));

describe('triage score', () => {
  test('the default weights add up to 100, so the score is the sum of the points shown', () => {
    const w = DEFAULT_TRIAGE_WEIGHTS;
    expect(w.serviceArea + w.jobSize + w.photos + w.measurement + w.response).toBe(100);
    const { score, reasons } = triageScore(strong, w);
    expect(score).toBe(100);
    expect(reasons.reduce((sum, r) => sum + r.points, 0)).toBe(score);
  });

  test('every reason is named with what was found, the timeline one as not asked and not counted', () => {
    const { reasons } = triageScore(
      { ...strong, insideServiceArea: false, coveredSqFt: 150, photoCount: 0, measuredBy: 'homeowner-estimate' },
      DEFAULT_TRIAGE_WEIGHTS,
    );
    expect(reasons.map((r) => r.id)).toEqual(['service-area', 'job-size', 'photos', 'measurement', 'timeline', 'response']);
    expect(reasons.find((r) => r.id === 'timeline')).toMatchObject({ counted: false, points: 0, of: 0, detail: expect.stringContaining('Not asked') });
    expect(reasons.find((r) => r.id === 'service-area')!.detail).toBe('Outside the service area');
    expect(reasons.find((r) => r.id === 'job-size')!.detail).toBe('150 sq ft of wall covered (all points from 300 sq ft)');
    expect(reasons.find((r) => r.id === 'photos')!.detail).toBe('No photos given');
  });

  test('each reason earns its share: size and photos in proportion, measurement by how far it can be trusted', () => {
    // 150 of 300 sq ft: half of 25, rounded; 1 of 3 photos: a third of 15.
    expect(points({ ...strong, coveredSqFt: 150, photoCount: 1, measuredBy: 'homeowner-tape' })).toMatchObject({
      'job-size': '13/25',
      photos: '5/15',
      measurement: '12/15',
    });
    expect(points({ ...strong, measuredBy: 'homeowner-estimate' }).measurement).toBe('5/15');
    expect(points({ ...strong, insideServiceArea: false })['service-area']).toBe('0/20');
    // A firm that lists no area serves anywhere.
    expect(triageScore({ ...strong, hasServiceArea: false }, DEFAULT_TRIAGE_WEIGHTS).reasons[0]!.detail).toContain('lists no service area');
  });

  test('response so far: on time keeps the points, late halves them, waiting past the target loses them', () => {
    const due = new Date('2026-12-04T18:00:00Z');
    expect(points({ ...strong, firstContactAt: new Date('2026-12-04T17:00:00Z'), responseDueAt: due }).response).toBe('25/25');
    expect(points({ ...strong, firstContactAt: new Date('2026-12-04T19:00:00Z'), responseDueAt: due }).response).toBe('13/25');
    expect(points({ ...strong, now: new Date('2026-12-04T18:00:01Z'), responseDueAt: due }).response).toBe('0/25');
    expect(points({ ...strong, responseDueAt: null }).response).toBe('25/25');
  });

  test('owner weights that do not add up to 100 are scaled, and the score stays within 0–100', () => {
    const doubled = triageWeightsSchema.parse({ serviceArea: 40, jobSize: 50, photos: 30, measurement: 30, response: 50 });
    expect(triageScore(strong, doubled).score).toBe(100);
    const weak = {
      ...strong,
      insideServiceArea: false,
      coveredSqFt: 0,
      photoCount: 0,
      measuredBy: 'homeowner-estimate' as const,
      now: new Date('2026-12-05T00:00:00Z'),
    };
    // Only the measurement's 30 % of 30 points is left: 9 of 200 points, 4.5 → 5.
    expect(triageScore(weak, doubled).score).toBe(5);
    const nothing = triageWeightsSchema.parse({ serviceArea: 0, jobSize: 0, photos: 0, measurement: 0, response: 0 });
    expect(triageScore(strong, nothing).score).toBe(0);
  });
});
