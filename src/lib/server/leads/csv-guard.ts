/**
 * A cell of an exported sheet that a spreadsheet would read as a formula is written as text:
 * one leading apostrophe before `=`, `+`, `-`, `@`, a tab or a carriage return.
 * Source: OWASP, "CSV Injection" (the characters and the leading single quote).
 */
const FORMULA_START = /^[=+\-@\t\r]/;

export function guardCell(value: string): string {
  return FORMULA_START.test(value) ? `'${value}` : value;
}
