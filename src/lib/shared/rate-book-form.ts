/**
 * The Rate book as the editor's form holds it, and the way back: money in the firm's currency
 * (stored as integer cents), percentages (stored as fractions), empty inputs for fields that may be
 * left out. `rateBookResolver` checks the form with the estimating core's own `rateBookSchema` (one
 * schema, no copy) and puts each problem on the field it is about, in the unit the owner typed.
 */
import { set, type FieldError, type FieldErrors, type FieldValues, type Resolver } from 'react-hook-form';
import type { z } from 'zod';
import { formatMoney, rateBookSchema, type RateBookInput } from '~/lib/estimate';
import { DEFAULT_TRIAGE_WEIGHTS } from '~/lib/estimate/schemas.ts';
import { appliesToTreatment, fieldAt, listAt, type FieldDescriptor } from './rate-book-fields';

/** Rate book values as the form holds them: the stored tree with money and percentages as typed. */
export type RateBookFormValues = FieldValues;

// Twelve significant digits drop the float noise of ×100 and ÷100 (0.07 × 100 = 7.000000000000001)
// and keep any fraction an owner could mean.
const tidy = (n: number) => Number.parseFloat(n.toPrecision(12));

export const centsToMoney = (cents: number): number => tidy(cents / 100);
export const moneyToCents = (amount: number): number => Math.round(amount * 100);
export const fractionToPercent = (fraction: number): number => tidy(fraction * 100);
export const percentToFraction = (percent: number): number => tidy(percent / 100);

/** Yes/no fields the schema defaults when left out; the form's checkbox shows that default. */
const FLAG_DEFAULTS: Record<string, boolean> = {
  'catalogue.sheets.*.moistureResistant': false,
  'catalogue.boards.*.moistureResistant': false,
  'catalogue.treatments.*.needsPrimer': true,
};

const isPlainObject = (value: unknown): value is Record<string, unknown> => value !== null && typeof value === 'object' && !Array.isArray(value);

/** Copies a tree, changing each leaf with `leaf(descriptor, value, path)`; undefined leaves are left out. */
function mapLeaves(value: unknown, path: string[], leaf: (field: FieldDescriptor | undefined, value: unknown, path: string[]) => unknown): unknown {
  if (Array.isArray(value)) return value.map((item, i) => mapLeaves(item, [...path, String(i)], leaf));
  if (isPlainObject(value)) {
    const out: Record<string, unknown> = {};
    for (const [key, item] of Object.entries(value)) {
      const mapped = mapLeaves(item, [...path, key], leaf);
      if (mapped !== undefined) out[key] = mapped;
    }
    return out;
  }
  return leaf(fieldAt(path), value, path);
}

/** A stored Rate book as the form's starting values. */
export function toFormValues(data: RateBookInput): RateBookFormValues {
  const values = mapLeaves(data, [], (field, value) => {
    if (typeof value !== 'number') return value;
    if (field?.kind === 'money') return centsToMoney(value);
    if (field?.kind === 'percent') return fractionToPercent(value);
    return value;
  }) as RateBookFormValues;
  // Triage weights are optional in stored books; the form shows the defaults they then use.
  values.triage = { ...DEFAULT_TRIAGE_WEIGHTS, ...(isPlainObject(values.triage) ? values.triage : {}) };
  for (const list of ['sheets', 'boards', 'treatments'] as const) {
    const rows = (values.catalogue as { [k: string]: unknown } | undefined)?.[list];
    if (!Array.isArray(rows)) continue;
    for (const row of rows as Record<string, unknown>[])
      for (const [pattern, fallback] of Object.entries(FLAG_DEFAULTS)) {
        const [, rowsName, , key] = pattern.split('.');
        if (rowsName === list && row[key!] === undefined) row[key!] = fallback;
      }
  }
  return values;
}

function numberOf(value: unknown): number | undefined {
  if (typeof value === 'number') return Number.isNaN(value) ? undefined : value;
  if (typeof value === 'string') {
    if (value.trim() === '') return undefined;
    const n = Number(value.trim());
    return Number.isNaN(n) ? Number.NaN : n;
  }
  return undefined;
}

function storedLeaf(field: FieldDescriptor | undefined, value: unknown): unknown {
  if (!field) return value;
  switch (field.kind) {
    case 'money':
    case 'percent':
    case 'hours':
    case 'inches':
    case 'count':
    case 'number': {
      const n = numberOf(value);
      if (n === undefined || Number.isNaN(n)) return n === undefined ? undefined : value;
      return field.kind === 'money' ? moneyToCents(n) : field.kind === 'percent' ? percentToFraction(n) : n;
    }
    case 'text':
    case 'choice':
    case 'reference':
      return field.optional && (value === '' || value === null) ? undefined : value;
    case 'flag':
      return value;
  }
}

/**
 * The form's values as a stored Rate book input: units converted back, empty optional inputs left
 * out, and each treatment keeping only the fields of its kind (a row whose kind was changed keeps
 * the inputs of its former kind in the form, which the strict schema would refuse).
 */
export function toRateBookInput(values: RateBookFormValues): unknown {
  const input = mapLeaves(values, [], storedLeaf) as Record<string, unknown>;
  const treatments = (input.catalogue as Record<string, unknown> | undefined)?.treatments;
  if (Array.isArray(treatments)) {
    for (const row of treatments as Record<string, unknown>[]) {
      if (!isPlainObject(row)) continue;
      const kind = row.kind as string | undefined;
      const source = isPlainObject(row.source) ? row.source : undefined;
      for (const key of Object.keys(row)) {
        if (key === 'source') continue;
        const field = fieldAt(['catalogue', 'treatments', '0', key]);
        if (field && !appliesToTreatment(field, kind, undefined)) delete row[key];
      }
      if (kind !== 'shiplap') delete row.source;
      else if (source) {
        for (const key of Object.keys(source)) {
          const field = fieldAt(['catalogue', 'treatments', '0', 'source', key]);
          if (field && !appliesToTreatment(field, kind, source.from as string | undefined)) delete source[key];
        }
      }
    }
  }
  return input;
}

const percentText = (fraction: number) => `${fractionToPercent(fraction)} %`;

/** Money for a message; a currency or locale being typed may not be a valid one yet. */
function moneyText(cents: number, currency: string, locale: string): string {
  try {
    return formatMoney(cents, currency, locale);
  } catch (error) {
    if (error instanceof RangeError) return `${centsToMoney(cents)} ${currency}`;
    throw error;
  }
}

/**
 * A schema message in the unit the owner types: a markup "at most 3" is "at most 300 %", a price
 * limit in cents is an amount of money. `issue` carries the exact bound when the message came from
 * zod here; a message from the server is reworded from its text.
 */
export function displayMessage(path: string, message: string, issue?: z.core.$ZodIssue, currency = 'USD', locale = 'en-US'): string {
  const field = fieldAt(path);
  if (!field || (field.kind !== 'percent' && field.kind !== 'money')) return message;
  const show = (stored: number) => (field.kind === 'percent' ? percentText(stored) : moneyText(Math.round(stored), currency, locale));
  if (issue && (issue.code === 'too_big' || issue.code === 'too_small')) {
    const bound = Number(issue.code === 'too_big' ? issue.maximum : issue.minimum);
    if (issue.code === 'too_small' && bound === 0) return `${field.label} cannot be negative.`;
    return `${field.label} must be at ${issue.code === 'too_big' ? 'most' : 'least'} ${show(bound)}.`;
  }
  if (field.kind === 'percent')
    return message.replace(/\bat (most|least) (-?\d+(?:\.\d+)?)(?=\.?$)/, (_, which: string, n: string) => `at ${which} ${percentText(Number(n))}`);
  return message.replace(/ must be a whole number of cents\.$/, ' must be an amount of money.');
}

/** Each problem zod found, as `{ "catalogue.sheets.0.priceCents": "message" }` (the first per field). */
export function rateBookFieldMessages(issues: readonly z.core.$ZodIssue[], currency?: string, locale?: string): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of issues) {
    const path = issue.path.map(String).join('.');
    if (!(path in out)) out[path] = displayMessage(path, issue.message, issue, currency, locale);
  }
  return out;
}

/**
 * Field messages in react-hook-form's nested shape. A message about a whole list (too many rows)
 * goes on the list's `root`, as react-hook-form keeps field-array errors; one about the whole book
 * on `root`.
 */
export function nestFieldMessages(messages: Record<string, string>): FieldErrors {
  const errors: FieldErrors = {};
  for (const [path, message] of Object.entries(messages)) {
    const error: FieldError = { type: 'validate', message };
    const at = path === '' ? 'root' : listAt(path) ? `${path}.root` : path;
    set(errors, at, error);
  }
  return errors;
}

/** What the currency and locale fields say right now, for money in messages. */
function moneySettings(values: RateBookFormValues): { currency?: string; locale?: string } {
  const currency = typeof values.currency === 'string' && /^[A-Z]{3}$/.test(values.currency) ? values.currency : undefined;
  const locale = typeof values.locale === 'string' && values.locale !== '' ? values.locale : undefined;
  return { currency, locale };
}

/**
 * react-hook-form's resolver for the editor: the form's values converted to a stored Rate book and
 * checked by `rateBookSchema`. Valid values come out as the stored input the server is sent.
 */
export const rateBookResolver: Resolver<RateBookFormValues, unknown, RateBookInput> = async (values) => {
  const input = toRateBookInput(values);
  const result = rateBookSchema.safeParse(input);
  if (result.success) return { values: input as RateBookInput, errors: {} };
  const { currency, locale } = moneySettings(values);
  return { values: {}, errors: nestFieldMessages(rateBookFieldMessages(result.error.issues, currency, locale)) };
};
