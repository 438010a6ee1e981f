import { describe, expect, test } from 'vitest';
import { finishFacts, phoneSearchForms, searchPatterns, searchTextOf } from './list-search';

/** What `LIKE` would say, for checking patterns without a database (no escapes used in these cases). */
const like = (text: string, pattern: string) => text.includes(pattern.replace(/^%|%$/g, '').replace(/\\([\\%_])/g, '$1'));
const matches = (text: string, term: string) => searchPatterns(term).every((p) => like(text, p));

const lead = {
  name: 'Dana Whitfield',
  email: 'dana.w@homeowner.test',
  phone: '+15125550147',
  reference: 'K7MX-42QD',
  address: '418 Juniper Bend',
  postcode: '78704',
};

describe('phone search forms', () => {
  // Source: ITU-T E.164 (country code 1 for the North American Numbering Plan, 44 for the UK) and
  // the UK trunk prefix 0 in national dialling (Ofcom's national telephone numbering plan), as
  // libphonenumber-js formats them.
  test('a North American number: with and without the country code', () => {
    expect(phoneSearchForms('+15125550147')).toEqual(['15125550147', '5125550147']);
  });

  test('a UK number: the national form keeps its trunk 0', () => {
    expect(phoneSearchForms('+442079460958')).toEqual(['442079460958', '02079460958']);
  });
});

describe('search', () => {
  const text = searchTextOf(lead);

  test.each(['512 555 0147', '(512) 555-0147', '+1 512 555 0147', '512.555.0147', '5550147', '1-512-555-0147'])('finds the phone typed as %s', (term) => {
    expect(matches(text, term)).toBe(true);
  });

  test.each(['dana', 'WHITFIELD', 'dana.w@homeowner', 'k7mx-42qd', 'juniper', '78704', 'juniper 418'])('finds %s', (term) => {
    expect(matches(text, term)).toBe(true);
  });

  test.each(['512 555 0148', 'maple', 'dana smith'])('does not find %s', (term) => {
    expect(matches(text, term)).toBe(false);
  });

  test('a postcode of digits is a phone-like term but still matches the postcode', () => {
    expect(searchPatterns('78704')).toEqual(['%78704%']);
  });

  test('LIKE wildcards typed by a person are taken literally', () => {
    expect(searchPatterns('100%_off')).toEqual(['%100\\%\\_off%']);
  });

  test('an empty term searches for nothing', () => {
    expect(searchPatterns('   ')).toEqual([]);
  });
});

describe('finish facts', () => {
  test('names each finish once, in room order, and the trade kinds sorted', () => {
    const rooms = [
      { treatmentName: 'Beadboard wainscot', treatmentKind: 'beadboard' as const },
      { treatmentName: 'Shiplap', treatmentKind: 'shiplap' as const },
      { treatmentName: 'Beadboard wainscot', treatmentKind: 'beadboard' as const },
    ];
    expect(finishFacts(rooms)).toEqual({ label: 'Beadboard wainscot, Shiplap', kinds: ['beadboard', 'shiplap'] });
  });
});
