/** Routes of the public Price widget: no session, no staff CSRF rule (they have their own CORS rules). */
export function isPublicWidgetPath(pathname: string): boolean {
  return /^\/(embed|demo|api\/embed)(\/|$)/.test(pathname) || pathname === '/widget.js';
}

/** The staff area's pages. */
export function isStaffPagePath(pathname: string): boolean {
  return /^\/app(\/|$)/.test(pathname);
}

/** The staff area's JSON API. */
export function isStaffApiPath(pathname: string): boolean {
  return /^\/api\/app(\/|$)/.test(pathname);
}

/** Where a request that changes something must come from our own pages (see csrf.ts). */
export function needsSameOrigin(pathname: string): boolean {
  return isStaffPagePath(pathname) || isStaffApiPath(pathname) || /^\/(api\/auth|login|logout|invite|reset)(\/|$)/.test(pathname);
}

/** Only paths inside the staff area are followed after sign-in, so a link cannot send people elsewhere. */
export function safeNextPath(next: string | null | undefined): string {
  if (!next || !/^\/app(\/[A-Za-z0-9\-._~/%?=&]*)?$/.test(next) || next.includes('//')) return '/app';
  return next;
}
