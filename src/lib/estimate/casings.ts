/**
 * Casings around doors and windows: the treatment stops at the casing's outside edge, so each
 * opening blocks the wall as a rectangle grown by its casing on both sides and above the head.
 */
import { overlap, subtractIntervals, type Interval } from './geometry.ts';
import type { PlacedOpening } from './types.ts';

// A common door and window casing, 2-1/4 in wide and 11/16 in thick (a stock colonial or ranch
// profile). From memory; common practice, no source. See docs/sources.md §30.
export const DEFAULT_CASING = { width: 2.25, thickness: 0.6875 } as const;

/**
 * The part of the wall an opening and its casing take: casing on both sides and above the head
 * (a door's casing stands on the floor; a window's stool and apron are left to the sill), clipped to
 * the wall's ends so a door set hard against a corner does not block wall that is not there.
 */
export function casingBlock(o: PlacedOpening, wallLength: number): PlacedOpening {
  const c = o.casingWidth ?? 0;
  if (c <= 0) return o;
  const x0 = Math.max(0, o.offset - c);
  const x1 = Math.min(wallLength, o.offset + o.width + c);
  return { ...o, offset: x0, width: x1 - x0, height: o.height + c };
}

/**
 * Area (sq in) of the band [bottom, top] × [0, wallLength] that the blocks cover, each point counted
 * once: where two casings touch or overlap, the shared strip comes off the wall only once.
 */
export function blockedAreaSqIn(blocks: PlacedOpening[], wallLength: number, bottom: number, top: number): number {
  const edges = new Set<number>([0, wallLength]);
  for (const b of blocks) for (const e of [b.offset, b.offset + b.width]) if (e > 0 && e < wallLength) edges.add(e);
  const xs = [...edges].sort((a, b) => a - b);
  let area = 0;
  for (let i = 0; i + 1 < xs.length; i++) {
    const x0 = xs[i]!;
    const x1 = xs[i + 1]!;
    const spans: Interval[] = blocks
      .filter((b) => overlap(b.offset, b.offset + b.width, x0, x1) > 1e-9)
      .map((b) => [Math.max(bottom, b.sillHeight), Math.min(top, b.sillHeight + b.height)] as const)
      .filter(([a, b]) => b > a);
    if (spans.length === 0) continue;
    const open = subtractIntervals([bottom, top], spans, 0).reduce((s, [a, b]) => s + (b - a), 0);
    area += (x1 - x0) * (top - bottom - open);
  }
  return area;
}
