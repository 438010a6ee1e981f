import { describe, expect, test } from 'vitest';
import { stringify } from 'csv-stringify/sync';
import { guardCell } from './csv-guard';

describe('guardCell', () => {
  // Source: OWASP, "CSV Injection": cells starting with =, +, -, @, tab (0x09) or carriage return
  // (0x0D) are prefixed with a single quote so a spreadsheet shows them as text.
  test.each(['=HYPERLINK("http://x.test","hi")', '+1 512 555 0147', '-2+3', '@SUM(A1)', '\tx', '\rx'])('prefixes %j', (value) => {
    expect(guardCell(value)).toBe(`'${value}`);
  });

  test.each(['Dana Whitfield', '512 555 0147', '', "O'Brien", 'a=b'])('leaves %j alone', (value) => {
    expect(guardCell(value)).toBe(value);
  });

  test('a guarded row is still quoted as CSV quotes', () => {
    // Source: RFC 4180 §2 (a field with a comma, a quote or a line break is enclosed in double
    // quotes, and a quote inside it is doubled).
    expect(stringify([[guardCell('=1+2'), 'Smith, "Jo"', 'two\nlines']])).toBe(`'=1+2,"Smith, ""Jo""","two\nlines"\n`);
  });
});
