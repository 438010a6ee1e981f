import type { Company } from './company.entity';
import { milesBetween, postcodeCentroid } from './postcode-centroids';

type ServiceAreaOf = Pick<Company, 'servicePostcodes' | 'serviceRadiusMiles' | 'addressPostcode'>;

/**
 * Whether a postcode is inside the firm's service area: within the radius of the office's postcode
 * when the firm set one (a postcode we cannot place is outside), else by the postcode list (leading
 * characters match; an empty list is anywhere).
 */
export function servesPostcode(company: ServiceAreaOf, postcode: string): boolean {
  if (company.serviceRadiusMiles !== null) {
    const office = company.addressPostcode ? postcodeCentroid(company.addressPostcode) : null;
    const there = postcodeCentroid(postcode);
    // The radius is saved only around a postcode we can place; an office moved to one we cannot
    // leaves no centre, and then nothing is refused for it.
    if (!office) return true;
    return there !== null && milesBetween(office, there) <= company.serviceRadiusMiles;
  }
  const compact = (code: string) => code.replace(/[\s-]/g, '').toUpperCase();
  return company.servicePostcodes.length === 0 || company.servicePostcodes.some((prefix) => compact(postcode).startsWith(compact(prefix)));
}
