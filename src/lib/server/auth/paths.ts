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

/** The homeowner's own link to a visit (`/visit/TOKEN`) and its routes: no session, our pages only. */
export function isHomeownerVisitPath(pathname: string): boolean {
  return /^\/(api\/)?visit(\/|$)/.test(pathname);
}

/** Where a request that changes something must come from our own pages (see csrf.ts). */
export function needsSameOrigin(pathname: string): boolean {
  return (
    isStaffPagePath(pathname) || isStaffApiPath(pathname) || isHomeownerVisitPath(pathname) || /^\/(api\/auth|login|logout|invite|reset)(\/|$)/.test(pathname)
  );
}

/** Only paths inside the staff area are followed after sign-in, so a link cannot send people elsewhere. */
export function safeNextPath(next: string | null | undefined): string {
  if (!next || !/^\/app(\/[A-Za-z0-9\-._~/%?=&]*)?$/.test(next) || next.includes('//')) return '/app';
  return next;
}

const UNRESERVED = /^[A-Za-z0-9\-._~]$/;

/**
 * The one spelling of a path that the guards above understand: repeated slashes collapsed, escapes
 * of unreserved characters decoded, dot segments resolved. Astro's router ignores a doubled leading
 * slash and decodes escapes, so `//app` or `/%61pp` would reach a route while a guard that matches
 * on the text sees no `/app` (see canonical-path.ts, which refuses any other spelling).
 * Source: RFC 3986 §6.2.2.2 (percent-encoding normalisation) and §5.2.4 (remove_dot_segments).
 */
export function canonicalPath(pathname: string): string {
  const decoded = pathname.replace(/%([0-9A-Fa-f]{2})/g, (escape, hex: string) => {
    const char = String.fromCharCode(parseInt(hex, 16));
    return UNRESERVED.test(char) ? char : escape;
  });
  const segments = decoded
    .replace(/\/{2,}/g, '/')
    .split('/')
    .slice(1);
  const kept: string[] = [];
  segments.forEach((segment, index) => {
    const last = index === segments.length - 1;
    if (segment === '.' || segment === '..') {
      if (segment === '..') kept.pop();
      // A final dot segment leaves the path ending in a slash (RFC 3986 §5.2.4, step 2B/2C).
      if (last) kept.push('');
    } else {
      kept.push(segment);
    }
  });
  return `/${kept.join('/')}`;
}
