/**
 * How one firm writes dates, lengths, areas and money, as one object. Safe for islands: an island
 * gets the four settings as props and calls `formatsFor` itself; the server builds the same object
 * with `firmFormats` (src/lib/server/rates/firm-formats.ts).
 */
import { formatArea, formatLength, formatMoney, type FormatLengthOptions, type Units } from '~/lib/estimate';
import { formatInZone, isoInZone, type DateStyle, type Instant } from './time';

export type FormatSettings = {
  /** IANA zone of the firm's office (`Company.timeZone`). */
  timeZone: string;
  /** The firm's measuring system (from its published Rate book). */
  units: Units;
  /** ISO 4217 code (from its published Rate book). */
  currency: string;
  /** BCP 47 locale for numbers and money (from its published Rate book). */
  locale: string;
};

export type Formats = FormatSettings & {
  /** A moment in the firm's zone; `day` for lists, `dateTimeZone` for e-mails. */
  date(at: Instant, style?: DateStyle): string;
  /** The same moment as ISO 8601 with the zone's offset, for `<time datetime>`. */
  isoDate(at: Instant): string;
  /** A length given in inches, in the firm's units (`3' 3-1/2"` or `1003 mm`). */
  length(inches: number, options?: FormatLengthOptions): string;
  /** An area given in square feet, in the firm's units (`412 sq ft` or `38.3 m²`). */
  area(sqFt: number): string;
  /** Integer cents in the firm's currency and locale. */
  money(cents: number, options?: { wholeUnits?: boolean }): string;
};

export function formatsFor(settings: FormatSettings): Formats {
  const { timeZone, units, currency, locale } = settings;
  return {
    timeZone,
    units,
    currency,
    locale,
    date: (at, style = 'date') => formatInZone(at, timeZone, style),
    isoDate: (at) => isoInZone(at, timeZone),
    length: (inches, options) => formatLength(inches, units, options),
    area: (sqFt) => formatArea(sqFt, units),
    money: (cents, options) => formatMoney(cents, currency, locale, options),
  };
}
