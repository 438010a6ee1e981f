import type { Company } from './company.entity';

/** Whether a postcode is inside the firm's service area (leading characters match; empty list = anywhere). */
export function servesPostcode(company: Company, postcode: string): boolean {
  const compact = (code: string) => code.replace(/[\s-]/g, '').toUpperCase();
  return company.servicePostcodes.length === 0 || company.servicePostcodes.some((prefix) => compact(postcode).startsWith(compact(prefix)));
}
