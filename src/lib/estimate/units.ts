/**
 * Lengths, areas and volumes. Internally every length is in inches and every area in square feet;
 * the firm's units only matter when reading what people type and when writing text for people.
 */

export type Units = 'imperial' | 'metric';

// Source: NBS Circular 572 addendum (1960) and NIST SP 811 Appendix B — 1 in = 25.4 mm exactly.
export const MM_PER_INCH = 25.4;
export const SQ_IN_PER_SQ_FT = 144;
// Source: derived exactly from 1 in = 25.4 mm (NIST SP 811): 1 ft² = 0.3048² m² = 0.09290304 m².
export const SQ_M_PER_SQ_FT = 0.09290304;
// Source: NIST SP 811 Appendix B — 1 US gallon = 231 in³ exactly, 1 US fl oz = 1/128 gallon.
export const CUBIC_IN_PER_GALLON = 231;
export const CUBIC_IN_PER_FL_OZ = 231 / 128;
// 231 in³ × 16.387064 cm³/in³ = 3785.411784 cm³, exact from the inch definition.
export const LITRES_PER_GALLON = 3.785411784;

export const inchesToMm = (inches: number): number => inches * MM_PER_INCH;
export const mmToInches = (mm: number): number => mm / MM_PER_INCH;
export const sqFtToSqM = (sqFt: number): number => sqFt * SQ_M_PER_SQ_FT;
export const sqInToSqFt = (sqIn: number): number => sqIn / SQ_IN_PER_SQ_FT;

/** Thrown when typed text is not a length; the message says what was expected. */
export class LengthParseError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'LengthParseError';
  }
}

const IMPERIAL_EXAMPLES = 'a length like 39 1/2, 39-1/2", 3\' 3-1/2" or 3 ft 3.5 in';
const METRIC_EXAMPLES = 'a length like 1003 mm, 100.3 cm or 1.003 m';

const DEC = String.raw`(?:\d+(?:\.\d*)?|\.\d+)`;
// Source: ISO 80000-1:2009 §7.3.2 — the decimal sign is a comma or a point on the line. Only metric text
// reads a comma as a decimal sign (8,5 m); in feet and inches a comma is not a decimal sign.
const METRIC_DEC = String.raw`(?:\d+(?:[.,]\d*)?|[.,]\d+)`;
// A whole number with an optional fraction ("39 1/2", "39-1/2"), a bare fraction, or a decimal.
const mixed = (name: string): string =>
  String.raw`(?:(?<${name}Whole>\d+)[\s-]+(?<${name}Num>\d+)\s*\/\s*(?<${name}Den>\d+)|(?<${name}FracNum>\d+)\s*\/\s*(?<${name}FracDen>\d+)|(?<${name}Dec>${DEC}))`;
// Source: NIST SP 811 §5.3 and Appendix B for the symbols ft and in; the prime and double prime are
// trade usage for feet and inches (common practice, no source).
const FEET_UNIT = String.raw`(?:'|ft\.?|feet|foot)`;
const INCH_UNIT = String.raw`(?:"|''|in\.?|inch|inches)`;
// Feet may carry a fraction too ("7 1/2 ft", "7-1/2'"), then optional inches ("7 ft 6 in", "7' 6\"").
const IMPERIAL_RE = new RegExp(String.raw`^(?:${mixed('ft')}\s*${FEET_UNIT})?\s*-?\s*(?:${mixed('in')}\s*(?:${INCH_UNIT})?)?$`);
const METRIC_RE = new RegExp(String.raw`^(${METRIC_DEC})\s*(mm|millimet(?:er|re)s?|cm|centimet(?:er|re)s?|m|met(?:er|re)s?)?$`);

function normalise(text: string): string {
  return text
    .trim()
    .toLowerCase()
    .replace(/[\u2032\u2019\u00b4]/g, "'")
    .replace(/[\u2033\u201d\u201c]/g, '"')
    .replace(/\u2044/g, '/')
    .replace(/,(?=\d{3}\b)/g, '') // 1,003 mm
    .replace(/\s+/g, ' ');
}

function fraction(numerator: string, denominator: string, whole: string | undefined, original: string): number {
  const n = Number(numerator);
  const d = Number(denominator);
  if (d === 0) throw new LengthParseError(`A fraction cannot have 0 below the line; got "${original}".`);
  if (whole !== undefined && n >= d) {
    throw new LengthParseError(`The fraction in "${original}" should be less than one, like 3-1/2.`);
  }
  return (whole === undefined ? 0 : Number(whole)) + n / d;
}

/** The number held by one of the regex's mixed-number groups, or undefined when that part was not typed. */
function readMixed(groups: Record<string, string | undefined>, name: string, original: string): number | undefined {
  const whole = groups[`${name}Whole`];
  if (whole !== undefined) return fraction(groups[`${name}Num`]!, groups[`${name}Den`]!, whole, original);
  const fracNum = groups[`${name}FracNum`];
  if (fracNum !== undefined) return fraction(fracNum, groups[`${name}FracDen`]!, undefined, original);
  const dec = groups[`${name}Dec`];
  return dec === undefined ? undefined : Number(dec);
}

function parseMetric(s: string, bareIsMm: boolean, original: string): number | undefined {
  const m = METRIC_RE.exec(s);
  if (!m) return undefined;
  const value = Number(m[1]!.replace(',', '.'));
  const unit = m[2];
  if (unit === undefined) return bareIsMm ? mmToInches(value) : undefined;
  if (unit.startsWith('mm') || unit.startsWith('milli')) return mmToInches(value);
  if (unit.startsWith('c')) return mmToInches(value * 10);
  if (unit === 'm' || unit.startsWith('met')) return mmToInches(value * 1000);
  throw new LengthParseError(`Expected ${METRIC_EXAMPLES}; got "${original}".`);
}

/**
 * Reads a length the way people type it from a tape and returns inches.
 * Imperial: `39 1/2`, `39-1/2"`, `3' 3-1/2"`, `3 ft 3.5 in`, `7 1/2 ft`, `7-1/2 ft`; a bare number means inches.
 * Metric: `1003 mm`, `100.3 cm`, `1.003 m`, `2,44 m` (decimal comma); a bare number means millimetres.
 * Text with an explicit metric unit is accepted whatever the firm's units.
 * @throws LengthParseError whose message says what was expected.
 */
export function parseLength(text: string, units: Units): number {
  if (typeof text !== 'string') throw new LengthParseError(`Expected ${units === 'metric' ? METRIC_EXAMPLES : IMPERIAL_EXAMPLES}.`);
  const s = normalise(text);
  const expected = units === 'metric' ? METRIC_EXAMPLES : IMPERIAL_EXAMPLES;
  if (s === '') throw new LengthParseError(`Expected ${expected}; got nothing.`);
  if (s.startsWith('-')) throw new LengthParseError(`Expected a positive length (${expected}); got "${text}".`);

  const metric = parseMetric(s, units === 'metric', text);
  if (metric !== undefined) return metric;

  const g = IMPERIAL_RE.exec(s)?.groups;
  const feet = g === undefined ? undefined : readMixed(g, 'ft', text);
  const inchPart = g === undefined ? undefined : readMixed(g, 'in', text);
  if (feet === undefined && inchPart === undefined) {
    throw new LengthParseError(`Expected ${expected}; got "${text}".`);
  }
  const value = (feet ?? 0) * 12 + (inchPart ?? 0);
  if (!Number.isFinite(value)) throw new LengthParseError(`Expected ${expected}; got "${text}".`);
  return value;
}

export interface FormatLengthOptions {
  /** Imperial only: `feet` writes 3' 3-1/2" (the default from 12 in up), `inches` writes 39-1/2". */
  style?: 'feet' | 'inches';
  /** Metric only: the unit to write (default mm). */
  metricUnit?: 'mm' | 'cm' | 'm';
}

function gcd(a: number, b: number): number {
  return b === 0 ? a : gcd(b, a % b);
}

function sixteenths(n: number): string {
  const whole = Math.floor(n / 16);
  const rest = n % 16;
  if (rest === 0) return String(whole);
  const g = gcd(rest, 16);
  const frac = `${rest / g}/${16 / g}`;
  return whole === 0 ? frac : `${whole}-${frac}`;
}

/**
 * Writes a length for people. Imperial rounds to the nearest 1/16 in (`3' 3-1/2"`), metric to the
 * nearest millimetre (`1003 mm`), so that `parseLength(formatLength(x))` is within 1/16 in of x.
 */
export function formatLength(inches: number, units: Units, opts: FormatLengthOptions = {}): string {
  if (!Number.isFinite(inches)) throw new RangeError('formatLength needs a finite number of inches');
  const sign = inches < 0 ? '-' : '';
  const abs = Math.abs(inches);
  if (units === 'metric') {
    const mm = Math.round(inchesToMm(abs));
    const unit = opts.metricUnit ?? 'mm';
    if (unit === 'cm') return `${sign}${trimZeros((mm / 10).toFixed(1))} cm`;
    if (unit === 'm') return `${sign}${trimZeros((mm / 1000).toFixed(3))} m`;
    return `${sign}${mm} mm`;
  }
  const total16 = Math.round(abs * 16);
  const style = opts.style ?? (total16 >= 12 * 16 ? 'feet' : 'inches');
  if (style === 'inches') return `${sign}${sixteenths(total16)}"`;
  const feet = Math.floor(total16 / (12 * 16));
  const rest = total16 - feet * 12 * 16;
  if (rest === 0) return `${sign}${feet}'`;
  return feet === 0 ? `${sign}${sixteenths(rest)}"` : `${sign}${feet}' ${sixteenths(rest)}"`;
}

function trimZeros(s: string): string {
  return s.includes('.') ? s.replace(/\.?0+$/, '') : s;
}

/** Writes an area given in square feet: `412 sq ft` or `38.3 m²`. */
export function formatArea(sqFt: number, units: Units): string {
  if (units === 'metric') return `${trimZeros(sqFtToSqM(sqFt).toFixed(1))} m²`;
  return `${trimZeros(sqFt.toFixed(1))} sq ft`;
}
