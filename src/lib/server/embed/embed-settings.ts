import type { Company } from '../companies/company.entity';
import { config } from '../config';
import type { RateBook } from '~/lib/estimate';
import { textOn } from '~/lib/shared/contrast';

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

/** White or ink text on the firm's brand colour, whichever contrasts more (see `~/lib/shared/contrast`). */
export function textOnBrand(hex: string): '#FFFFFF' | '#1F2A2E' {
  return textOn(hex);
}
