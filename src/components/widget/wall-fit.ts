/**
 * Whether a wall's doors, windows and fixtures fit on it, worked out in the browser as the homeowner
 * types, with the same placing rules as the estimating core (so the message appears at once, next to
 * that wall, instead of only after a round trip). The server still checks with the firm's own casing.
 */
import { FIXTURE_TABLE, tryPlaceFixtures } from '~/lib/estimate/fixtures.ts';
import { DEFAULT_DOOR, DEFAULT_WINDOW, tryPlaceOpenings } from '~/lib/estimate/geometry.ts';
import type { FixtureKind, Wall } from '~/lib/estimate/schemas.ts';
import { formatLength, type Units } from '~/lib/estimate/units.ts';

/** The casing most firms use (2-1/4 in, docs/sources.md §30); the server uses the firm's own. */
export const USUAL_CASING_WIDTH = 2.25;

export type WallContents = { doors: number; windows: number; fixtures: FixtureKind[] };

/** Writes a length the way a tape reads, always with inches ("5' 0"", not "5'"). */
export function tapeLength(inches: number, units: Units): string {
  const text = formatLength(inches, units);
  return units === 'imperial' && /'$/.test(text) ? `${text} 0"` : text;
}

const counted = (n: number, one: string, many: string): string[] => (n <= 0 ? [] : [n === 1 ? one : `${n} ${many}`]);

/** "door", "2 doors and window", "door, window and tub": the things on a wall, as a phrase. */
export function describeContents(c: WallContents): string {
  const fixtureCounts = new Map<FixtureKind, number>();
  for (const f of c.fixtures) fixtureCounts.set(f, (fixtureCounts.get(f) ?? 0) + 1);
  const parts = [
    ...counted(c.doors, 'door', 'doors'),
    ...counted(c.windows, 'window', 'windows'),
    ...[...fixtureCounts].flatMap(([kind, n]) => counted(n, FIXTURE_TABLE[kind].name, `${FIXTURE_TABLE[kind].name}s`)),
  ];
  if (parts.length <= 1) return parts[0] ?? '';
  return `${parts.slice(0, -1).join(', ')} and ${parts.at(-1)}`;
}

function openingsOf(c: WallContents): Wall['openings'] {
  return [...(c.doors ? [{ kind: 'door' as const, count: c.doors }] : []), ...(c.windows ? [{ kind: 'window' as const, count: c.windows }] : [])];
}

/** Total width of the things on the wall, without the clearances between them. */
export function contentsWidth(c: WallContents): number {
  return c.doors * DEFAULT_DOOR.width + c.windows * DEFAULT_WINDOW.width + c.fixtures.reduce((sum, f) => sum + FIXTURE_TABLE[f].width, 0);
}

/** True when the core would find a place for everything on a wall this long. */
export function fits(c: WallContents, wallLength: number, casingWidth = USUAL_CASING_WIDTH): boolean {
  const openings = tryPlaceOpenings(openingsOf(c), wallLength, casingWidth);
  if (!openings.ok) return false;
  return tryPlaceFixtures(
    c.fixtures.map((kind) => ({ kind })),
    wallLength,
    openings.openings,
  ).ok;
}

/**
 * The homeowner's message when the wall's contents do not fit, or null when they do. Sizes are the
 * usual ones the core assumes for a counted door (36 in), window (36 in) or fixture.
 */
export function fitProblem(c: WallContents, wallLength: number, units: Units, casingWidth = USUAL_CASING_WIDTH): string | null {
  if (fits(c, wallLength, casingWidth)) return null;
  const what = describeContents(c);
  const total = contentsWidth(c);
  const many = c.doors + c.windows + c.fixtures.length > 1;
  const subject = `The ${what}`;
  if (total > wallLength + 1e-6) {
    return `${subject} ${many ? 'add up to' : 'is'} ${tapeLength(total, units)}${many ? '' : ' wide'}, more than this ${tapeLength(wallLength, units)} wall. Move ${many ? 'one of them' : 'it'} to another wall, or check the wall's length.`;
  }
  return `${subject} ${many ? 'need' : 'needs'} a little room beside ${many ? 'each' : 'it'} for the trim, more than this ${tapeLength(wallLength, units)} wall has. Move ${many ? 'one of them' : 'it'} to another wall, or check the wall's length.`;
}
