/**
 * Paint and primer bought in the containers a store sells (quart, gallon, 5-gallon pail): the
 * cheapest combination whose volume covers what the job needs. This is a small unbounded min-cost
 * covering problem, solved exactly by dynamic programming over volume.
 */

export interface Container {
  name: string;
  /** US gallons (1 US gal = 231 in³, NIST SP 811; docs/sources.md §25). */
  gallons: number;
  priceCents: number;
}

export interface Pack {
  name: string;
  gallons: number;
  priceCents: number;
  count: number;
}

export interface ContainerChoice {
  /** Containers bought, largest first; empty when nothing is needed. */
  packs: Pack[];
  gallons: number;
  totalCents: number;
}

/**
 * Volumes are worked in whole US fluid ounces (1/128 gal) so sums are exact: a listed size is
 * rounded to the nearest ounce, at most half an ounce off (about 15 mL).
 */
const OUNCES_PER_GALLON = 128;

/** Exact: 1 US gallon = 231 in³ and 1 in = 2.54 cm, so 3.785411784 L (NIST Handbook 44 Appendix C; docs/sources.md §25). */
export const LITRES_PER_US_GALLON = 3.785411784;

const gcd = (a: number, b: number): number => (b === 0 ? a : gcd(b, a % b));

/**
 * The cheapest set of containers holding at least `gallonsNeeded`; ties go to the smaller volume,
 * then to fewer containers.
 *
 * Exact, and bounded however large the job: let B be the container with the lowest price per
 * gallon (the smallest of those on a tie). Among any B-size-many other containers, some non-empty
 * group adds up to a whole number of B's (pigeonhole on running totals modulo B's size), and
 * swapping that group for B's costs no more and holds the same. So some cheapest answer has fewer
 * than size(B) other containers, at most (size(B) − 1) × size(largest) of volume; everything beyond
 * that is B's, bought first, and the DP covers only the rest.
 */
export function cheapestContainers(gallonsNeeded: number, containers: readonly Container[]): ContainerChoice {
  if (!(gallonsNeeded > 1e-9)) return { packs: [], gallons: 0, totalCents: 0 };
  const usable = containers.filter((c) => Math.round(c.gallons * OUNCES_PER_GALLON) > 0);
  if (usable.length === 0) throw new RangeError('cheapestContainers: no container to buy');

  // Work in steps of the greatest common size so that common US sizes (32, 128, 640 oz) need few states.
  const ounces = usable.map((c) => Math.round(c.gallons * OUNCES_PER_GALLON));
  const step = ounces.reduce(gcd);
  const size = ounces.map((o) => o / step);
  const need = Math.ceil((gallonsNeeded * OUNCES_PER_GALLON) / step - 1e-9);

  let best = 0;
  for (let i = 1; i < usable.length; i++) {
    const ratio = usable[i]!.priceCents * size[best]!;
    const bestRatio = usable[best]!.priceCents * size[i]!;
    if (ratio < bestRatio || (ratio === bestRatio && size[i]! < size[best]!)) best = i;
  }
  const largest = Math.max(...size);
  const sB = size[best]!;
  const bulk = Math.max(0, Math.floor((need - (sB - 1) * largest - sB) / sB));
  const rest = need - bulk * sB;

  // cost[v]: cheapest exact volume v (in steps); count[v]: containers used; from[v]: last container.
  const top = rest + largest;
  const cost = new Float64Array(top + 1).fill(Infinity);
  const count = new Float64Array(top + 1).fill(Infinity);
  const from = new Int32Array(top + 1).fill(-1);
  cost[0] = 0;
  count[0] = 0;
  for (let v = 1; v <= top; v++) {
    for (let i = 0; i < usable.length; i++) {
      const prev = v - size[i]!;
      if (prev < 0 || cost[prev] === Infinity) continue;
      const c = cost[prev]! + usable[i]!.priceCents;
      const n = count[prev]! + 1;
      if (c < cost[v]! || (c === cost[v]! && n < count[v]!)) {
        cost[v] = c;
        count[v] = n;
        from[v] = i;
      }
    }
  }
  let end = -1;
  for (let v = Math.max(0, rest); v <= top; v++) if (cost[v] !== Infinity && (end < 0 || cost[v]! < cost[end]!)) end = v;

  const counts = usable.map(() => 0);
  counts[best] = bulk;
  for (let v = end; v > 0; v -= size[from[v]!]!) counts[from[v]!]! += 1;
  const packs = usable
    .map((c, i) => ({ name: c.name, gallons: c.gallons, priceCents: c.priceCents, count: counts[i]! }))
    .filter((p) => p.count > 0)
    .sort((a, b) => b.gallons - a.gallons);
  return {
    packs,
    gallons: packs.reduce((s, p) => s + p.count * p.gallons, 0),
    totalCents: packs.reduce((s, p) => s + p.count * p.priceCents, 0),
  };
}

/** "1 gallon + 2 quarts": each container name, made plural with an s when more than one. */
export function describePacks(packs: readonly Pack[]): string {
  return packs.map((p) => `${p.count} ${p.count === 1 || p.name.endsWith('s') ? p.name : `${p.name}s`}`).join(' + ');
}
