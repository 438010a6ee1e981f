/**
 * The window stool (the inside ledge at the sill) where the new work meets it: the apron under the
 * stool is reset on the new face, and when new face plus apron would come out past the stool's nose
 * (less the reveal it should keep), the stool and apron are taken off and refitted: extended, re-cut
 * or replaced (common practice, no source; docs/sources.md §51).
 */
import { CASING_REVEAL, newFaceThickness } from './build-up.ts';
import type { Catalogue, Treatment } from './schemas.ts';
import type { PlacedOpening } from './types.ts';

/**
 * How far the new face plus the apron reset on it stands out past the point CASING_REVEAL behind the
 * stool's nose (0 when it does not). The apron is taken to be as thick as the casing, the stock it is
 * usually cut from (common practice, no source). Picture frames stand clear of the trim, under a
 * margin, so the apron stays on the old wall.
 */
export function proudOfStool(t: Treatment, c: Catalogue): number {
  if (t.kind === 'picture-frame') return 0;
  return Math.max(0, newFaceThickness(t, c) + c.casing.thickness - (c.stoolProjection - CASING_REVEAL));
}

/**
 * The windows whose stool the work meets: a cased window whose sill lies inside the covered band, so
 * the treatment runs up under its apron. A window without a casing has a plain returned sill, no stool.
 */
export function windowsWithStoolInBand(openings: PlacedOpening[], bandBottom: number, bandTop: number): PlacedOpening[] {
  return openings.filter((o) => o.kind === 'window' && (o.casingWidth ?? 0) > 0 && o.sillHeight > bandBottom && o.sillHeight < bandTop);
}

/**
 * Painted surface that comes off with one refitted stool and apron, sq in, for the lead-safe rule
 * (docs/sources.md §5): the apron, as long as the window plus both casings and as tall as the casing
 * is wide, and the stool's top where it stands out from the wall. A lower bound: the stool's top
 * back to the sash is not counted.
 */
export function stoolAndApronSqIn(o: PlacedOpening, c: Catalogue): number {
  const casing = o.casingWidth ?? 0;
  const run = o.width + 2 * casing;
  return run * casing + run * c.stoolProjection;
}
