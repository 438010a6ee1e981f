import { describe, expect, it } from 'vitest';
import { sampleRateBook } from '~/lib/estimate';
import { nestFieldMessages, rateBookResolver, toFormValues, type RateBookFormValues } from '~/lib/shared/rate-book-form';
import type { ResolverOptions } from 'react-hook-form';
import { problemsOf, whereIs } from './error-summary';
import { newTreatment } from './new-rows';

describe('the editor’s list of problems', () => {
  it('names the row and the field of each message', () => {
    expect(whereIs('catalogue.sheets.1.priceCents')).toBe('Sheet 2 · Sheet price');
    expect(whereIs('catalogue.mouldings.0.longerLengths.2.length')).toBe('Moulding 1 · Longer length 3 · Longer stock length');
    expect(whereIs('materialMarkup')).toBe('Material markup');
    expect(whereIs('catalogue.treatments.root')).toBe('Finishes');
  });

  it('lists every message of a nested error tree, list messages included', () => {
    const problems = problemsOf(nestFieldMessages({ 'catalogue.sheets.0.priceCents': 'Sheet price cannot be negative.', 'catalogue.treatments': 'Too many.' }));
    expect(problems).toEqual([
      { path: 'catalogue.sheets.0.priceCents', where: 'Sheet 1 · Sheet price', message: 'Sheet price cannot be negative.' },
      { path: 'catalogue.treatments.root', where: 'Finishes', message: 'Too many.' },
    ]);
  });
});

describe('a new finish', () => {
  it('asks for what its kind needs and nothing it does not', async () => {
    const values: RateBookFormValues = toFormValues(sampleRateBook());
    values.catalogue.treatments.push(newTreatment('picture-frame'));
    const { errors } = await rateBookResolver(values, undefined, { fields: {}, shouldUseNativeValidation: false } as ResolverOptions<RateBookFormValues>);
    const paths = problemsOf(errors).map((p) => p.path);
    expect(paths).toEqual(
      expect.arrayContaining([
        'catalogue.treatments.7.id',
        'catalogue.treatments.7.mouldingId',
        'catalogue.treatments.7.margin',
        'catalogue.treatments.7.sqFtPerHour',
      ]),
    );
    expect(paths.every((p) => p.startsWith('catalogue.treatments.7.'))).toBe(true);
  });
});
