import { formatMoney } from '~/lib/estimate';
import { fieldAt } from '~/lib/shared/rate-book-fields';
import { fractionToPercent } from '~/lib/shared/rate-book-form';

/** A stored value as the owner reads it: money in the currency, fractions as percentages. */
export function storedText(path: string, value: unknown, currency: string, locale: string): string {
  if (value === undefined || value === null || value === '') return 'empty';
  const field = fieldAt(path);
  if (typeof value === 'number' && field?.kind === 'money' && Number.isInteger(value)) return formatMoney(value, currency, locale);
  if (typeof value === 'number' && field?.kind === 'percent') return `${fractionToPercent(value)} %`;
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (typeof value === 'object') return Array.isArray(value) ? `${value.length} rows` : 'changed';
  return `${String(value)}${field?.unit && field.kind !== 'money' ? ` ${field.unit}` : ''}`;
}
