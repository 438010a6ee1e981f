/**
 * An inquiry's triage score: a number from 0 to 100 with every reason that made it, so staff can see
 * why one inquiry ranks above another. Pure; the server stores the score on the lead for sorting and
 * the inquiry page shows the reasons. Safe for islands and the server alike.
 */
import type { MeasuredBy, TriageWeights } from '~/lib/estimate/schemas.ts';

export type TriageFacts = {
  /** Inside the firm's service area (a firm that lists no area serves anywhere). */
  insideServiceArea: boolean;
  /** The firm lists a service area at all. */
  hasServiceArea: boolean;
  /** Net covered wall area of the whole job, square feet. */
  coveredSqFt: number;
  photoCount: number;
  measuredBy: MeasuredBy;
  firstContactAt: Date | null;
  responseDueAt: Date | null;
  now: Date;
};

export type TriageReasonId = 'service-area' | 'job-size' | 'photos' | 'measurement' | 'timeline' | 'response';

export type TriageReason = {
  id: TriageReasonId;
  label: string;
  /** What was found, in words. */
  detail: string;
  /** Points earned, whole numbers. */
  points: number;
  /** Points this reason can give; 0 for a reason that does not count (see `counted`). */
  of: number;
  /** False when the reason could not be judged and adds nothing either way. */
  counted: boolean;
};

export type Triage = { score: number; reasons: TriageReason[] };

/**
 * How much each way of measuring is trusted: a site measurement is exact, a homeowner's tape close,
 * a homeowner's guess rough (common practice, no source).
 */
export const MEASUREMENT_SHARE: Record<MeasuredBy, number> = { 'site-measure': 1, 'homeowner-tape': 0.8, 'homeowner-estimate': 0.3 };

const MEASUREMENT_WORDS: Record<MeasuredBy, string> = {
  'site-measure': 'Measured on site',
  'homeowner-tape': 'Measured by the homeowner with a tape',
  'homeowner-estimate': 'Sizes guessed by the homeowner',
};

/** A contact after the target still counts for half: the homeowner heard from the firm, later than promised. */
const LATE_CONTACT_SHARE = 0.5;

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/**
 * Works out the score. Each reason earns its share of its weight; the score is the points earned
 * over the points possible, scaled to 100 (with the default weights, which add up to 100, it is
 * simply the sum of the points shown).
 */
export function triageScore(facts: TriageFacts, weights: TriageWeights, formatArea: (sqFt: number) => string = (a) => `${Math.round(a)} sq ft`): Triage {
  const share = (fraction: number, weight: number) => Math.round(Math.max(0, Math.min(1, fraction)) * weight);
  const reasons: TriageReason[] = [];

  reasons.push({
    id: 'service-area',
    label: 'Service area',
    detail: !facts.hasServiceArea
      ? 'The firm lists no service area, so every address is inside it'
      : facts.insideServiceArea
        ? 'Inside the service area'
        : 'Outside the service area',
    points: share(facts.insideServiceArea ? 1 : 0, weights.serviceArea),
    of: weights.serviceArea,
    counted: true,
  });

  reasons.push({
    id: 'job-size',
    label: 'Size of job',
    detail: `${formatArea(facts.coveredSqFt)} of wall covered (all points from ${formatArea(weights.fullSizeSqFt)})`,
    points: share(facts.coveredSqFt / weights.fullSizeSqFt, weights.jobSize),
    of: weights.jobSize,
    counted: true,
  });

  reasons.push({
    id: 'photos',
    label: 'Photos',
    detail: facts.photoCount === 0 ? 'No photos given' : `${plural(facts.photoCount, 'photo', 'photos')} given (all points from ${weights.fullPhotos})`,
    points: share(facts.photoCount / weights.fullPhotos, weights.photos),
    of: weights.photos,
    counted: true,
  });

  reasons.push({
    id: 'measurement',
    label: 'How it was measured',
    detail: MEASUREMENT_WORDS[facts.measuredBy],
    points: share(MEASUREMENT_SHARE[facts.measuredBy], weights.measurement),
    of: weights.measurement,
    counted: true,
  });

  // The price widget does not ask when the homeowner wants the work done; until it does, this
  // reason is shown (so its absence is not a mystery) and counts for nothing either way.
  reasons.push({
    id: 'timeline',
    label: "Homeowner's timeline",
    detail: 'Not asked: the price widget has no question about when the work should start, so this counts for nothing',
    points: 0,
    of: 0,
    counted: false,
  });

  reasons.push({ id: 'response', label: 'Response so far', ...responseReason(facts, weights.response, share) });

  const possible = reasons.reduce((sum, r) => sum + r.of, 0);
  const earned = reasons.reduce((sum, r) => sum + r.points, 0);
  const score = possible === 0 ? 0 : Math.max(0, Math.min(100, Math.round((100 * earned) / possible)));
  return { score, reasons };
}

function responseReason(facts: TriageFacts, weight: number, share: (fraction: number, weight: number) => number): Omit<TriageReason, 'id' | 'label'> {
  const { firstContactAt, responseDueAt, now } = facts;
  const base = { of: weight, counted: true };
  if (firstContactAt) {
    if (!responseDueAt || firstContactAt.getTime() <= responseDueAt.getTime()) {
      return { ...base, detail: 'Contacted within the response target', points: share(1, weight) };
    }
    return { ...base, detail: 'Contacted, but after the response target', points: share(LATE_CONTACT_SHARE, weight) };
  }
  if (responseDueAt && now.getTime() > responseDueAt.getTime()) {
    return { ...base, detail: 'Not contacted yet, and past the response target', points: 0 };
  }
  return { ...base, detail: 'Not contacted yet, still within the response target', points: share(1, weight) };
}
