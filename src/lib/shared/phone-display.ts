/**
 * A homeowner's phone (stored as E.164) written the way the firm's staff dial it: national format
 * for a number in the firm's own country, international format for any other. Safe for islands.
 */
import { parsePhoneNumberFromString, type CountryCode } from 'libphonenumber-js/min';

/** The country of a BCP 47 locale (`en-US` → `US`), or undefined when the locale names none. */
export function countryOfLocale(locale: string): CountryCode | undefined {
  try {
    return (new Intl.Locale(locale).region as CountryCode | undefined) ?? undefined;
  } catch (error) {
    if (error instanceof RangeError) return undefined;
    throw error;
  }
}

export function displayPhone(e164: string, firmCountry: CountryCode | undefined): string {
  const parsed = parsePhoneNumberFromString(e164);
  if (!parsed) return e164;
  return firmCountry && parsed.country === firmCountry ? parsed.formatNational() : parsed.formatInternational();
}
