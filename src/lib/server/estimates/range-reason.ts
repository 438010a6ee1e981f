import type { MeasuredBy } from '~/lib/estimate/schemas';

/** How the walls were measured, as the grammatical subject of the reason. */
const SIZES: Record<MeasuredBy, { clause: string; subjectIsYou: boolean }> = {
  'homeowner-estimate': { clause: 'the sizes are estimates', subjectIsYou: false },
  'homeowner-tape': { clause: 'you measured with a tape', subjectIsYou: true },
  'site-measure': { clause: 'the walls were measured on site', subjectIsYou: false },
};

/** A fraction as a percentage, to a tenth at most: 0.15 → "15 %", 0.025 → "2.5 %". */
const percent = (f: number): string => `${Math.round(f * 1000) / 10} %`;

/**
 * One short sentence on why the range is as wide as it is: the rate book's spread for how the walls
 * were measured and whether photos came, e.g. "The range is ±15 % because the sizes are estimates and
 * there are no photos yet."
 */
export function rangeReason(measuredBy: MeasuredBy, photoCount: number, spread: { below: number; above: number }): string {
  const width =
    spread.below === spread.above
      ? `The range is ±${percent(spread.below)}`
      : `The range runs from ${percent(spread.below)} below to ${percent(spread.above)} above`;
  const sizes = SIZES[measuredBy];
  const sent = photoCount === 1 ? 'sent a photo' : 'sent photos';
  const photos = photoCount === 0 ? 'there are no photos yet' : sizes.subjectIsYou ? sent : `you ${sent}`;
  return `${width} because ${sizes.clause} and ${photos}.`;
}
