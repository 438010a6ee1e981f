/**
 * Which stock length a cut comes from: the shortest length the stock is sold in that holds the cut;
 * a cut longer than every length is joined from several pieces of the longest.
 */
import type { MouldingStock } from './schemas.ts';

export interface StockLength {
  length: number;
  priceCents: number;
}

/** Every length a moulding is sold in, shortest first (its main length and any longer ones). */
export function stockLengthsOf(stock: Pick<MouldingStock, 'length' | 'priceCents'> & { longerLengths?: StockLength[] }): StockLength[] {
  return [{ length: stock.length, priceCents: stock.priceCents }, ...(stock.longerLengths ?? [])].sort((a, b) => a.length - b.length);
}

export interface StockCut {
  /** The stock length the pieces come from. */
  stockLength: number;
  /** The pieces to cut: one, or several when the run is joined. */
  pieces: number[];
  /** Scarf joints in the run (pieces − 1). */
  joints: number;
}

const EPS = 1e-9;

/**
 * Source: This Old House, "Splicing Molding" — moulding spliced with a scarf joint: both ends bevel-cut
 * to 45°, glued and nailed. A 45° bevel through the thickness t runs t along the length (tan 45° = 1,
 * computed here), so the two pieces overlap by the moulding's thickness at each joint.
 */
export function scarfOverlap(thickness: number): number {
  return thickness;
}

/**
 * The pieces a run of moulding `cut` inches long needs: from the shortest stock length that holds it,
 * else joined from n equal pieces of the longest, n the fewest for which each piece, with the joints'
 * overlap shared among them, fits: (cut + (n − 1)·overlap) / n ≤ longest.
 */
export function stockCutFor(lengths: StockLength[], cut: number, thickness: number): StockCut {
  const fits = lengths.find((l) => cut <= l.length + EPS);
  if (fits) return { stockLength: fits.length, pieces: [cut], joints: 0 };
  const longest = lengths[lengths.length - 1]!.length;
  const overlap = Math.min(scarfOverlap(thickness), longest / 2);
  const n = Math.max(2, Math.ceil((cut - overlap) / (longest - overlap) - EPS));
  const piece = Math.min(longest, (cut + (n - 1) * overlap) / n);
  return { stockLength: longest, pieces: Array.from({ length: n }, () => piece), joints: n - 1 };
}
