/**
 * What the widget says under a length field: how the typed text was read ("= 5' 0"") and, when a bare
 * number makes little sense in the unit a bare number means, which of the two readings was meant.
 * Pure functions, so the rules can be tested without a browser.
 */
import { formatLength, LengthParseError, mmToInches, parseLength, type Units } from '~/lib/estimate/units.ts';

/** What a length field holds; each kind has its own plausible range for the "inches or feet?" question. */
export type LengthKind = 'room-length' | 'room-width' | 'wall-length' | 'ceiling-height' | 'wainscot-height' | 'opening-width' | 'opening-height' | 'length';

export type ReadBack = { state: 'empty' } | { state: 'read'; text: string; inches: number } | { state: 'unreadable'; message: string };

/** "= 5' 0"" for imperial (feet and inches from a foot up), "= 2.44 m" or "= 900 mm" for metric. */
export function readBack(text: string, units: Units): ReadBack {
  if (text.trim() === '') return { state: 'empty' };
  let inches: number;
  try {
    inches = parseLength(text, units);
  } catch (e) {
    if (e instanceof LengthParseError) return { state: 'unreadable', message: e.message };
    throw e;
  }
  return { state: 'read', text: `= ${describe(inches, units)}`, inches };
}

function describe(inches: number, units: Units): string {
  if (units === 'metric') {
    // Metres from a metre up, so a bare "2440" (millimetres) is seen to mean 2.44 m.
    return formatLength(inches, 'metric', { metricUnit: Math.round(inches * 25.4) >= 1000 ? 'm' : 'mm' });
  }
  const written = formatLength(inches, 'imperial');
  // Whole feet get an explicit 0" so "5'" cannot be misread as 5 in at a glance.
  return written.endsWith("'") ? `${written} 0"` : written;
}

/**
 * Plausible sizes in inches for each kind of field: common practice, no source. A room under 2 1/2 ft
 * or a ceiling under 6 ft is not what homeowners price; the upper ends leave room for large houses.
 */
const PLAUSIBLE_INCHES: Record<Exclude<LengthKind, 'length'>, readonly [number, number]> = {
  'room-length': [30, 720],
  'room-width': [30, 720],
  'wall-length': [12, 720],
  'ceiling-height': [72, 300],
  'wainscot-height': [12, 144],
  'opening-width': [12, 192],
  'opening-height': [12, 144],
};

export type UnitChoice = { label: string; text: string };
/** The two readings offered: `small` is what a bare number means today (inches / millimetres). */
export type InchesOrFeet = { small: UnitChoice; large: UnitChoice };

// A bare number: no unit, no prime. Imperial allows a fraction ("7 1/2"); metric a decimal comma.
const BARE_IMPERIAL = /^(?:\d+(?:\.\d+)?|\.\d+|\d+[\s-]+\d+\s*\/\s*\d+|\d+\s*\/\s*\d+)$/;
const BARE_METRIC = /^(?:\d+(?:[.,]\d+)?|[.,]\d+)$/;

/**
 * Null, or the question to ask: the text is a bare number, its usual reading (inches; millimetres for a
 * metric firm) is implausible for this kind of field, and the larger unit (feet; metres) is plausible.
 */
export function inchesOrFeet(text: string, units: Units, kind: LengthKind): InchesOrFeet | null {
  if (kind === 'length') return null;
  const bare = text.trim().replace(/\s+/g, ' ');
  if (!(units === 'metric' ? BARE_METRIC : BARE_IMPERIAL).test(bare)) return null;
  let asSmall: number;
  try {
    asSmall = parseLength(bare, units);
  } catch {
    return null;
  }
  // Feet are 12 inches; metres are 1000 millimetres.
  const asLarge = units === 'metric' ? mmToInches(Number(bare.replace(',', '.')) * 1000) : asSmall * 12;
  const [min, max] = PLAUSIBLE_INCHES[kind];
  const plausible = (inches: number) => inches >= min && inches <= max;
  if (plausible(asSmall) || !plausible(asLarge)) return null;
  const [small, large] = units === 'metric' ? ['mm', 'm'] : ['in', 'ft'];
  return { small: { label: `${bare} ${small}`, text: `${bare} ${small}` }, large: { label: `${bare} ${large}`, text: `${bare} ${large}` } };
}
