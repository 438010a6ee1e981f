import { describe, expect, test } from 'vitest';
import { countryOfLocale, displayPhone } from './phone-display';

describe('a homeowner’s phone as the firm’s staff dial it', () => {
  test('a number in the firm’s country is written the national way', () => {
    // Source: North American Numbering Plan, national format (NPA) NXX-XXXX; from memory.
    expect(displayPhone('+15125550147', countryOfLocale('en-US'))).toBe('(512) 555-0147');
    // Source: Ofcom, numbers reserved for TV and radio drama (020 7946 0000–0999), written 020 xxxx xxxx.
    expect(displayPhone('+442079460958', countryOfLocale('en-GB'))).toBe('020 7946 0958');
  });

  test('a number from another country keeps its international form', () => {
    // Source: ITU-T Recommendation E.123, international notation: +, country code, groups separated by spaces.
    expect(displayPhone('+442079460958', 'US')).toBe('+44 20 7946 0958');
    expect(displayPhone('+15125550147', countryOfLocale('en-GB'))).toBe('+1 512 555 0147');
    expect(displayPhone('+15125550147', countryOfLocale('en'))).toBe('+1 512 555 0147');
  });

  test('something that is not a phone number is shown as stored', () => {
    expect(displayPhone('not a phone', 'US')).toBe('not a phone');
  });
});
