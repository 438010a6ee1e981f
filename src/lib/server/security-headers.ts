/**
 * The security headers of every answer the app renders, in one place (src/middleware.ts applies
 * them; scripts/serve.mjs gives the built files theirs, since those never reach the middleware).
 * Sources: OWASP HTTP Headers Cheat Sheet; OWASP Content Security Policy Cheat Sheet; OWASP REST
 * Security Cheat Sheet ("Security headers"); RFC 6797 (HSTS).
 */

/**
 * What a page's policy gets when it does not say otherwise. Astro writes `script-src` and `style-src`
 * itself, with the hash of every script and style it puts on the page (islands' inline bootstrap
 * included), plus the directives in astro.config.mjs. No page may be framed, except the widget's,
 * which names the firm's sites itself. Inline `style` attributes stay allowed: server-rendered React
 * components and the firm's brand colour use them, and a style attribute cannot run code.
 */
const PAGE_DEFAULTS = ["frame-ancestors 'none'", "style-src-attr 'unsafe-inline'"];

/**
 * HTML that Astro wrote no policy for: its built-in not-found page, which has no scripts, so none may
 * run; and every page under `astro dev`, which writes no policy (nor hashes to allow scripts by).
 */
const UNHASHED_PAGE_DEFAULTS = ["frame-ancestors 'none'", "object-src 'none'", "base-uri 'self'"];
const UNHASHED_PAGE_SCRIPTS = "script-src 'none'";

/** Answers that are not pages (JSON, redirects, plain text) may load nothing and be framed by no one. */
export const NOT_A_PAGE_POLICY = "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";

/** One year. Source: OWASP HTTP Strict Transport Security Cheat Sheet; RFC 6797 §6.1. */
export const STRICT_TRANSPORT_SECURITY = 'max-age=31536000; includeSubDomains';

function directivesOf(policy: string): string[] {
  return policy
    .split(';')
    .map((directive) => directive.trim().replace(/\s+/g, ' '))
    .filter(Boolean);
}

const nameOf = (directive: string) => directive.split(' ')[0]!.toLowerCase();

/**
 * The policy to send, given the one the answer came with and whether it is an HTML page.
 * A directive named twice keeps its first occurrence, as browsers do (CSP Level 3, §2.2.1 "parse a
 * serialized CSP"), so a page's own `frame-ancestors` wins over the default and none is doubled.
 */
export function completePolicy(rendered: string | null, { html, dev = false }: { html: boolean; dev?: boolean }): string {
  const directives = rendered ? directivesOf(rendered) : [];
  const hashed = directives.some((directive) => nameOf(directive) === 'script-src');
  if (!hashed && !html) return NOT_A_PAGE_POLICY;
  const defaults = hashed ? PAGE_DEFAULTS : [...UNHASHED_PAGE_DEFAULTS, ...(dev ? [] : [UNHASHED_PAGE_SCRIPTS])];
  const byName = new Map<string, string>();
  for (const directive of [...directives, ...defaults]) {
    if (!byName.has(nameOf(directive))) byName.set(nameOf(directive), directive);
  }
  return [...byName.values()].join('; ');
}

/** Whether a policy lets some site frame the answer (only the widget's embed page does). */
export function mayBeFramed(policy: string): boolean {
  const frameAncestors = directivesOf(policy).find((directive) => nameOf(directive) === 'frame-ancestors');
  return frameAncestors !== undefined && frameAncestors !== "frame-ancestors 'none'";
}

/**
 * Answers that must never be kept by a browser or a cache: the staff area and its API, and the
 * pages that carry a password or a one-time link. Source: OWASP Session Management Cheat Sheet
 * ("Web Content Caching").
 */
export function mustNotBeStored(pathname: string): boolean {
  return /^\/(app|api|login|reset|invite)(\/|$)/.test(pathname);
}
