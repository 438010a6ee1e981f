import type { Company } from '../companies/company.entity';
import { config } from '../config';
import type { RateBook } from '~/lib/estimate';

/** `frame-ancestors` for the embed page: our own pages (the demo) and the firm's allowed sites only. */
export function frameAncestors(company: Company): string {
  return ["'self'", ...company.embedOrigins].join(' ');
}

/**
 * The embedding page's origin as the loader reports it, accepted only when the firm allows it;
 * the widget then posts its height to that origin and no other.
 */
export function checkedHostOrigin(host: string | null, company: Company): string | null {
  if (!host) return null;
  let origin: string;
  try {
    origin = new URL(host).origin;
  } catch {
    return null;
  }
  return origin === config.publicOrigin || company.embedOrigins.includes(origin) ? origin : null;
}

/** The treatments a firm offers, without prices or productivity (those stay on the server). */
export function offeredTreatments(rateBook: RateBook) {
  return rateBook.catalogue.treatments
    .filter((t) => t.enabled)
    .map((t) => ({ id: t.id, name: t.name, kind: t.kind, ...(t.kind === 'shiplap' ? { orientation: t.orientation } : {}) }));
}

/** White or ink text on the firm's brand colour, whichever reads better (WCAG relative luminance). */
export function textOnBrand(hex: string): '#FFFFFF' | '#1F2A2E' {
  const channel = (i: number) => {
    const c = parseInt(hex.slice(1 + 2 * i, 3 + 2 * i), 16) / 255;
    // Source: WCAG 2.2, definition of relative luminance.
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  };
  const luminance = 0.2126 * channel(0) + 0.7152 * channel(1) + 0.0722 * channel(2);
  const contrast = (a: number, b: number) => (Math.max(a, b) + 0.05) / (Math.min(a, b) + 0.05);
  const inkLuminance = 0.0222; // #1F2A2E, computed with the same formula
  return contrast(luminance, 1) >= contrast(luminance, inkLuminance) ? '#FFFFFF' : '#1F2A2E';
}
