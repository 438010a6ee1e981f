/**
 * The estimating core states its length limits in inches ("must be at most 1200 in."). The homeowner
 * typed feet or metres, so the widget restates each limit in the units of the firm before showing it.
 */
import { inchesToMm, type Units } from '~/lib/estimate/units.ts';

const LIMIT_IN_INCHES = /\b(at least|at most) (\d+(?:\.\d+)?) in\./g;

/** Rewrites every "at least/at most N in." in a message; any other message comes back unchanged. */
export function lengthMessageInUnits(message: string, units: Units): string {
  return message.replace(LIMIT_IN_INCHES, (_all, bound: string, inches: string) => {
    // Round towards the allowed side so the stated limit is one the core accepts.
    const up = bound === 'at least';
    return `${bound} ${units === 'metric' ? metricLimit(Number(inches), up) : imperialLimit(Number(inches), up)}.`;
  });
}

function roundTowards(value: number, up: boolean): number {
  // The small tolerance keeps exact conversions (60 in = 1524 mm) from being nudged by binary rounding.
  return up ? Math.ceil(value - 1e-9) : Math.floor(value + 1e-9);
}

function metricLimit(inches: number, up: boolean): string {
  const mm = roundTowards(inchesToMm(inches), up);
  if (mm < 1000) return `${mm} mm`;
  return `${String(mm / 1000)} m`;
}

function imperialLimit(inches: number, up: boolean): string {
  const sixteenths = roundTowards(inches * 16, up);
  const feet = Math.floor(sixteenths / 192);
  const rest = sixteenths - feet * 192;
  const parts: string[] = [];
  if (feet > 0) parts.push(`${feet} ft`);
  if (rest > 0 || feet === 0) parts.push(`${inchText(rest)} in`);
  return parts.join(' ');
}

/** Sixteenths of an inch as 6, 1/16 or 3-1/2, the way a tape is read. */
function inchText(sixteenths: number): string {
  const whole = Math.floor(sixteenths / 16);
  let num = sixteenths % 16;
  if (num === 0) return String(whole);
  let den = 16;
  while (num % 2 === 0) {
    num /= 2;
    den /= 2;
  }
  return whole === 0 ? `${num}/${den}` : `${whole}-${num}/${den}`;
}
