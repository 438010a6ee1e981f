/**
 * How the Inquiries list finds an inquiry by what a salesperson types: a name, an e-mail, a phone
 * number written any way, a reference, a street or a postcode. Each lead keeps one lowercase
 * `search_text` (built here when it is stored), indexed by trigrams, so a search is a few `LIKE`
 * patterns that the index answers without reading the estimates.
 */
import { parsePhoneNumberFromString } from 'libphonenumber-js/min';
import type { RoomTakeoff } from '~/lib/estimate';

const digitsOf = (text: string) => text.replace(/\D/g, '');

/**
 * A phone's digits as it may be typed: the E.164 digits with the country code (`15125550147`) and
 * the national number with its trunk prefix (`5125550147`, `02079460958`), so "(512) 555-0147",
 * "512 555 0147", "+1 512 555 0147" and "020 7946 0958" all match by substring.
 */
export function phoneSearchForms(e164: string): string[] {
  const forms = new Set([digitsOf(e164)]);
  const parsed = parsePhoneNumberFromString(e164);
  if (parsed) forms.add(digitsOf(parsed.formatNational()));
  return [...forms].filter(Boolean);
}

export type SearchableLead = { name: string; email: string; phone: string; reference: string; address: string; postcode: string };

/** The text a lead is searched by (lowercase; the phone as digits). */
export function searchTextOf(lead: SearchableLead): string {
  return [lead.name, lead.email, lead.reference, lead.address, lead.postcode, ...phoneSearchForms(lead.phone)]
    .map((part) => part.toLowerCase().replace(/\s+/g, ' ').trim())
    .filter(Boolean)
    .join(' | ');
}

const escapeLike = (text: string) => text.replace(/[\\%_]/g, (c) => `\\${c}`);

/**
 * The `LIKE` patterns a search term turns into; a lead matches when its text matches all of them.
 * A term that looks like a phone number (digits with spaces, dots, dashes, brackets or a plus, and
 * at least four digits) is one pattern of its digits; otherwise each word is one pattern.
 */
export function searchPatterns(term: string): string[] {
  const trimmed = term.trim().toLowerCase();
  if (!trimmed) return [];
  if (/^[\d\s().+-]+$/.test(trimmed) && digitsOf(trimmed).length >= 4) return [`%${digitsOf(trimmed)}%`];
  return [...new Set(trimmed.split(/\s+/))].slice(0, 8).map((word) => `%${escapeLike(word)}%`);
}

/** The finishes of an estimate's rooms, for the list: the names as the firm calls them and the trade kinds. */
export function finishFacts(rooms: { treatmentName: RoomTakeoff['treatmentName']; treatmentKind: string }[]): { label: string; kinds: string[] } {
  const names = [...new Set(rooms.map((room) => room.treatmentName))];
  const kinds = [...new Set(rooms.map((room) => room.treatmentKind))].sort();
  return { label: names.join(', ').slice(0, 200), kinds };
}
