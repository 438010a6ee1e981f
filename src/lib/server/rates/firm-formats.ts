import type { EntityManager } from '@mikro-orm/postgresql';
import { formatsFor, type FormatSettings, type Formats } from '~/lib/shared/formats';
import { Company } from '../companies/company.entity';
import { publishedRatesIfAny } from './rate-book.service';

/**
 * What a firm shows until it publishes a Rate book. Such a firm has no estimates and no leads yet,
 * so only its dates (in its own zone) are on its pages.
 */
export const UNPUBLISHED_FORMATS = { units: 'imperial', currency: 'USD', locale: 'en-US' } as const satisfies Omit<FormatSettings, 'timeZone'>;

/**
 * How a firm writes dates, lengths, areas and money on staff pages and in e-mails: its time zone
 * from the firm, its units, currency and locale from its published Rate book.
 *
 *   const fmt = await firmFormats(em, staff.companyId);
 *   fmt.date(lead.createdAt, 'day'); fmt.length(wall.length); fmt.money(lead.rangeLowCents);
 */
export async function firmFormats(em: EntityManager, company: Company | string): Promise<Formats> {
  // An id, or a reference that was never loaded: read the firm itself.
  const firm =
    typeof company === 'string' || !company.timeZone ? await em.findOneOrFail(Company, { id: typeof company === 'string' ? company : company.id }) : company;
  const published = await publishedRatesIfAny(em, firm.id);
  const { units, currency, locale } = published?.rateBook ?? UNPUBLISHED_FORMATS;
  return formatsFor({ timeZone: firm.timeZone, units, currency, locale });
}
