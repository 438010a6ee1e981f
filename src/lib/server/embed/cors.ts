import type { Company } from '../companies/company.entity';
import { config } from '../config';

/**
 * CORS for the widget's public API: the embed page itself is on our origin; other callers must be
 * one of the firm's allowed sites. Never a reflected origin, never credentials.
 */
export function allowedOrigin(origin: string | null, company: Company): string | null {
  if (!origin) return null;
  if (origin === config.publicOrigin) return origin;
  return company.embedOrigins.includes(origin) ? origin : null;
}

export function corsHeaders(request: Request, company: Company): Record<string, string> {
  const origin = allowedOrigin(request.headers.get('origin'), company);
  const headers: Record<string, string> = { Vary: 'Origin' };
  if (origin) {
    headers['Access-Control-Allow-Origin'] = origin;
    headers['Access-Control-Allow-Methods'] = 'GET, POST, DELETE, OPTIONS';
    headers['Access-Control-Allow-Headers'] = 'Content-Type';
    headers['Access-Control-Max-Age'] = '600';
  }
  return headers;
}

/** A cross-origin request from a site the firm has not allowed: refused before any work is done. */
export function isForeignOrigin(request: Request, company: Company): boolean {
  const origin = request.headers.get('origin');
  return origin !== null && allowedOrigin(origin, company) === null;
}
