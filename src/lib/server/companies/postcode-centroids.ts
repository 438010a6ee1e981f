/**
 * Where a postcode lies, for a service area given as a distance from the office. The centroids ship
 * with the app (the `zipcodes` package: US ZIP codes, and Canada's forward sortation areas, the first
 * three characters of a postcode), so no lookup leaves the server.
 */
import { lookup } from 'zipcodes';

export type Centroid = { latitude: number; longitude: number };

/** The centroid of a US ZIP (five digits, a ZIP+4 read by its first five) or a Canadian postcode; null when unknown. */
export function postcodeCentroid(postcode: string): Centroid | null {
  const compact = postcode.replace(/[\s-]/g, '').toUpperCase();
  const key = /^\d{5}(\d{4})?$/.test(compact) ? compact.slice(0, 5) : /^[A-Z]\d[A-Z](\d[A-Z]\d)?$/.test(compact) ? compact.slice(0, 3) : null;
  if (!key) return null;
  const found = lookup(key);
  return found ? { latitude: found.latitude, longitude: found.longitude } : null;
}

/**
 * Mean radius of the Earth in statute miles: 6,371.0088 km (IUGG mean radius R1) ÷ 1.609344.
 * Source: Moritz, H., "Geodetic Reference System 1980", Journal of Geodesy 74 (2000) (from memory).
 */
export const EARTH_RADIUS_MILES = 3958.7613;

/**
 * Great-circle distance by the haversine formula. Source: R. W. Sinnott, "Virtues of the Haversine",
 * Sky and Telescope 68 (2), 1984, p. 159 (from memory). A centroid is the middle of an area, so
 * the distance is between middles, not doorsteps: good enough for "do we drive there".
 */
export function milesBetween(a: Centroid, b: Centroid): number {
  const rad = (degrees: number) => (degrees * Math.PI) / 180;
  const dLat = rad(b.latitude - a.latitude);
  const dLon = rad(b.longitude - a.longitude);
  const h = Math.sin(dLat / 2) ** 2 + Math.cos(rad(a.latitude)) * Math.cos(rad(b.latitude)) * Math.sin(dLon / 2) ** 2;
  return 2 * EARTH_RADIUS_MILES * Math.asin(Math.min(1, Math.sqrt(h)));
}
