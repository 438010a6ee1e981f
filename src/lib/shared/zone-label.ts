/**
 * How a homeowner is told which clock the visit times are on: the zone's generic English name and
 * its short name at that moment, `Central Time (CST)`. Both come from the runtime's Intl (CLDR
 * names); where English has no generic name the short one stands alone (`GMT+5:30`, `UTC`).
 */
import { zoneOrUtc } from './time';

function zonePart(at: Date, timeZone: string, style: 'short' | 'longGeneric'): string {
  const parts = new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: style }).formatToParts(at);
  return parts.find((part) => part.type === 'timeZoneName')?.value ?? '';
}

export function zoneLabel(timeZone: string, at: Date): string {
  const zone = zoneOrUtc(timeZone);
  if (zone === 'UTC' || zone === 'Etc/UTC') return 'UTC';
  const short = zonePart(at, zone, 'short');
  const generic = zonePart(at, zone, 'longGeneric');
  // A generic name that is only an offset ("GMT+05:30") says no more than the short one.
  return !generic || generic.startsWith('GMT') || generic === short ? short : `${generic} (${short})`;
}
