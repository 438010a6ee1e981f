import { describe, expect, test } from 'vitest';
import { NOT_A_PAGE_POLICY, completePolicy, mayBeFramed, mustNotBeStored } from './security-headers';

// What Astro 5 writes on a page with `experimental.csp` (its directives, then script-src, style-src).
const ASTRO = "object-src 'none';base-uri 'self';form-action 'self'; script-src 'self' 'sha256-AAAA' 'sha256-BBBB'; style-src 'self' 'sha256-CCCC';";

describe('completePolicy', () => {
  test('adds frame-ancestors and the style-attribute rule to a page’s policy, keeping its hashes', () => {
    expect(completePolicy(ASTRO, { html: true })).toBe(
      "object-src 'none'; base-uri 'self'; form-action 'self'; script-src 'self' 'sha256-AAAA' 'sha256-BBBB'; style-src 'self' 'sha256-CCCC'; frame-ancestors 'none'; style-src-attr 'unsafe-inline'",
    );
  });

  // Source: CSP Level 3, "parse a serialized CSP": a repeated directive is ignored after its first occurrence.
  test('keeps the page’s own frame-ancestors and never sends a directive twice', () => {
    const widget = `${ASTRO} frame-ancestors 'self' https://firm.test; frame-ancestors 'self' https://firm.test`;
    const policy = completePolicy(widget, { html: true });
    expect(policy.match(/frame-ancestors/g)).toHaveLength(1);
    expect(policy).toContain("frame-ancestors 'self' https://firm.test");
    expect(mayBeFramed(policy)).toBe(true);
  });

  test('gives answers that are not pages (JSON, redirects, text) the closed policy', () => {
    expect(completePolicy(null, { html: false })).toBe(NOT_A_PAGE_POLICY);
    expect(completePolicy("frame-ancestors 'self'", { html: false })).toBe(NOT_A_PAGE_POLICY);
    expect(mayBeFramed(NOT_A_PAGE_POLICY)).toBe(false);
  });

  test('HTML without hashes runs no script in a build (Astro’s own not-found page) and stays unframed', () => {
    expect(completePolicy(null, { html: true })).toBe("frame-ancestors 'none'; object-src 'none'; base-uri 'self'; script-src 'none'");
  });

  test('under astro dev, which writes no policy, scripts run and only the widget may be framed', () => {
    expect(completePolicy(null, { html: true, dev: true })).toBe("frame-ancestors 'none'; object-src 'none'; base-uri 'self'");
    const widget = completePolicy("frame-ancestors 'self' https://firm.test; object-src 'none'; base-uri 'self'", { html: true, dev: true });
    expect(widget).toBe("frame-ancestors 'self' https://firm.test; object-src 'none'; base-uri 'self'");
  });
});

test('the staff area, its API and the pages with passwords or one-time links are never stored', () => {
  for (const path of ['/app', '/app/leads/x', '/api/app/me', '/api/embed/x/estimate', '/login', '/reset', '/reset/abc', '/invite/abc']) {
    expect(mustNotBeStored(path), path).toBe(true);
  }
  for (const path of ['/', '/embed/cedar-hollow', '/widget.js', '/application', '/resetting']) {
    expect(mustNotBeStored(path), path).toBe(false);
  }
});
