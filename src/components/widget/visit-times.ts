/**
 * Visit times as the homeowner reads them: on the firm's clock, in words, with the zone named.
 * Browser Intl only (no date library in the widget); the runtime's tz data decides the offsets.
 */
import type { InquiryProof, PublicSlot } from '~/lib/shared/widget-visit-schemas';

type Parts = { weekday: string; month: string; day: string; year: string; hour: string; minute: string; dayPeriod: string; timeZoneName: string };

const formatters = new Map<string, Intl.DateTimeFormat>();

function partsOf(at: string | Date, timeZone: string): Parts {
  let format = formatters.get(timeZone);
  if (!format) {
    format = new Intl.DateTimeFormat('en-US', {
      timeZone,
      weekday: 'short',
      year: 'numeric',
      month: 'short',
      day: 'numeric',
      hour: 'numeric',
      minute: '2-digit',
      hour12: true,
      timeZoneName: 'short',
    });
    formatters.set(timeZone, format);
  }
  const parts = Object.fromEntries(format.formatToParts(new Date(at)).map((p) => [p.type, p.value]));
  return parts as Parts;
}

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** `Tue, Dec 8` */
export function dayLabel(at: string | Date, timeZone: string): string {
  const p = partsOf(at, timeZone);
  return `${p.weekday}, ${p.month} ${p.day}`;
}

/** `10:00 AM` (plain spaces, whatever the runtime puts before the AM). */
export function timeLabel(at: string | Date, timeZone: string): string {
  const p = partsOf(at, timeZone);
  return `${p.hour}:${p.minute} ${p.dayPeriod}`;
}

/** `Tue, Dec 8, 10:00 AM CST`: the zone's short name at that moment, so a time after a clock change says so. */
export function visitLabel(at: string | Date, timeZone: string): string {
  return `${dayLabel(at, timeZone)}, ${timeLabel(at, timeZone)} ${partsOf(at, timeZone).timeZoneName}`;
}

/** The local date `2026-12-08`, to group times by day. */
function localDate(at: string, timeZone: string): string {
  const p = partsOf(at, timeZone);
  return `${p.year}-${String(MONTHS.indexOf(p.month) + 1).padStart(2, '0')}-${p.day.padStart(2, '0')}`;
}

export type SlotDay = { date: string; label: string; slots: (PublicSlot & { time: string })[] };

/** The open times grouped by local day, in order, at most `days` days. */
export function slotDays(slots: PublicSlot[], timeZone: string, days = 10): SlotDay[] {
  const grouped: SlotDay[] = [];
  for (const slot of [...slots].sort((a, b) => Date.parse(a.start) - Date.parse(b.start))) {
    const date = localDate(slot.start, timeZone);
    let day = grouped[grouped.length - 1];
    if (day?.date !== date) {
      if (grouped.length === days) break;
      day = { date, label: dayLabel(slot.start, timeZone), slots: [] };
      grouped.push(day);
    }
    day.slots.push({ ...slot, time: timeLabel(slot.start, timeZone) });
  }
  return grouped;
}

/** The inquiry and key in the homeowner's private estimate link (`…/estimate/ID?key=KEY`), or null. */
export function proofFromViewUrl(viewUrl: string | null): InquiryProof | null {
  if (!viewUrl) return null;
  let url: URL;
  try {
    url = new URL(viewUrl, 'http://localhost');
  } catch {
    return null;
  }
  const match = url.pathname.match(/\/estimate\/([^/]+)$/);
  const key = url.searchParams.get('key');
  return match && key ? { lead: decodeURIComponent(match[1]!), key } : null;
}
