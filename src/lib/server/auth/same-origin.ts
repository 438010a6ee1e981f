import { config } from '../config';

export const NOT_FROM_OUR_PAGES = 'This request did not come from a Lapwing page, so it was refused. Reload the page and try again.';

/**
 * Whether a request that changes something comes from one of our own pages (the rule of csrf.ts;
 * routes outside the staff area that only our pages call check it too).
 *   1. `Sec-Fetch-Site`, when sent, must be `same-origin` (or `none`: typed by the person).
 *   2. `Origin` must be sent and be our origin.
 */
export function comesFromOurPages(request: Request, url: URL): boolean {
  const fetchSite = request.headers.get('sec-fetch-site');
  const origin = request.headers.get('origin');
  const ours = origin !== null && (origin === config.publicOrigin || origin === url.origin);
  return !(fetchSite && fetchSite !== 'same-origin' && fetchSite !== 'none') && ours;
}
