import { describe, expect, it } from 'vitest';
import type { FieldErrors, ResolverOptions } from 'react-hook-form';
import { get } from 'react-hook-form';
import { rateBookSchema, sampleRateBook } from '~/lib/estimate';
import { DEFAULT_TRIAGE_WEIGHTS } from '~/lib/estimate/schemas.ts';
import {
  centsToMoney,
  displayMessage,
  fractionToPercent,
  moneyToCents,
  percentToFraction,
  rateBookResolver,
  toFormValues,
  toRateBookInput,
  type RateBookFormValues,
} from './rate-book-form';

const options = { fields: {}, shouldUseNativeValidation: false } as ResolverOptions<RateBookFormValues>;

async function messagesFor(edit: (values: RateBookFormValues) => void): Promise<FieldErrors> {
  const values = toFormValues(sampleRateBook());
  edit(values);
  const result = await rateBookResolver(values, undefined, options);
  return result.errors;
}

const messageAt = (errors: FieldErrors, path: string) => (get(errors, path) as { message?: string } | undefined)?.message;

describe('money and percentages as the owner types them', () => {
  it('turns cents into the currency’s units and back', () => {
    // Source: ISO 4217 — USD has two minor-unit digits, so 1 dollar is 100 cents.
    expect(centsToMoney(3200)).toBe(32);
    expect(centsToMoney(1999)).toBe(19.99);
    expect(moneyToCents(19.99)).toBe(1999);
    expect(moneyToCents(0.1 + 0.2)).toBe(30);
  });

  it('turns fractions into percentages and back without float noise', () => {
    // Per cent means hundredths (ISO 80000-1 writes % = 0.01).
    expect(fractionToPercent(0.07)).toBe(7);
    expect(fractionToPercent(0.125)).toBe(12.5);
    expect(percentToFraction(7)).toBe(0.07);
    expect(percentToFraction(300)).toBe(3);
  });

  it('shows the demo rate book in display units and gives it back unchanged', () => {
    const values = toFormValues(sampleRateBook());
    expect(values.catalogue.sheets[0].priceCents).toBe(32);
    expect(values.materialMarkup).toBe(25);
    expect(values.range['site-measure'].withPhotos.below).toBe(3);
    expect(values.catalogue.sheets[0].moistureResistant).toBe(false);
    expect(toRateBookInput(values)).toEqual({ ...sampleRateBook(), triage: DEFAULT_TRIAGE_WEIGHTS, catalogue: withFlagDefaults() });
    expect(rateBookSchema.safeParse(toRateBookInput(values)).success).toBe(true);
  });
});

/** The demo catalogue with the yes/no fields it leaves to the schema's defaults spelled out. */
function withFlagDefaults() {
  const c = sampleRateBook().catalogue;
  return {
    ...c,
    sheets: c.sheets.map((s) => ({ moistureResistant: false, ...s })),
    boards: c.boards.map((b) => ({ moistureResistant: false, ...b })),
    treatments: c.treatments.map((t) => ({ needsPrimer: true, ...t })),
  };
}

describe('the editor’s resolver (the core’s rateBookSchema)', () => {
  it('accepts the demo rate book and hands back the stored input', async () => {
    const result = await rateBookResolver(toFormValues(sampleRateBook()), undefined, options);
    expect(result.errors).toEqual({});
    expect((result.values as { catalogue: { sheets: { priceCents: number }[] } }).catalogue.sheets[0]!.priceCents).toBe(3200);
  });

  it('puts a negative sheet price on that sheet’s price', async () => {
    const errors = await messagesFor((v) => (v.catalogue.sheets[1].priceCents = -12));
    expect(messageAt(errors, 'catalogue.sheets.1.priceCents')).toBe('Sheet price cannot be negative.');
    expect(messageAt(errors, 'catalogue.sheets.0.priceCents')).toBeUndefined();
  });

  it('names a markup of 10,000 % in percent, not as the stored fraction', async () => {
    const errors = await messagesFor((v) => (v.materialMarkup = 10000));
    expect(messageAt(errors, 'materialMarkup')).toBe('Material markup must be at most 300 %.');
  });

  it('names a price limit in money', async () => {
    const errors = await messagesFor((v) => (v.roundingCents = 0));
    expect(messageAt(errors, 'roundingCents')).toBe('Rounding step must be at least $0.01.');
  });

  it('puts a stock id that names nothing on the finish that uses it', async () => {
    const errors = await messagesFor((v) => (v.catalogue.treatments[2].battenId = 'oak-1x3-8'));
    expect(messageAt(errors, 'catalogue.treatments.2.battenId')).toBe('No board with id "oak-1x3-8" in the catalogue.');
  });

  it('puts a duplicate id on the second row that uses it', async () => {
    const errors = await messagesFor((v) => (v.catalogue.boards[3].id = 'pine-1x6-8'));
    expect(messageAt(errors, 'catalogue.boards.3.id')).toBe('Two boards share the id "pine-1x6-8".');
    expect(messageAt(errors, 'catalogue.boards.0.id')).toBeUndefined();
  });

  it('says a cleared required number is required, and leaves a cleared optional one to its default', async () => {
    const errors = await messagesFor((v) => {
      v.labour.rateCents = Number.NaN; // what an emptied number input gives
      v.catalogue.studSpacing = Number.NaN;
    });
    expect(messageAt(errors, 'labour.rateCents')).toBe('Labour rate per hour is required.');
    expect(messageAt(errors, 'catalogue.studSpacing')).toBeUndefined();
  });

  it('keeps only the fields of a finish’s kind after its kind is changed', async () => {
    const values = toFormValues(sampleRateBook());
    const row = values.catalogue.treatments[0]; // shiplap from sheets
    Object.assign(row, { kind: 'beadboard', sheetId: 'beadboard-4x8' });
    const input = toRateBookInput(values) as { catalogue: { treatments: Record<string, unknown>[] } };
    expect(input.catalogue.treatments[0]).not.toHaveProperty('source');
    expect(input.catalogue.treatments[0]).not.toHaveProperty('orientation');
    expect(input.catalogue.treatments[0]).not.toHaveProperty('gap');
    const result = await rateBookResolver(values, undefined, options);
    // It now points at a shiplap alternative, which is of another kind: that, and only that, is refused.
    expect(messageAt(result.errors, 'catalogue.treatments.0.dampRoomTreatmentId')).toBe(
      'The damp-room alternative must be the same kind of treatment (beadboard).',
    );
  });

  it('keeps only the source fields of a shiplap’s material', () => {
    const values = toFormValues(sampleRateBook());
    values.catalogue.treatments[0].source.from = 'boards';
    values.catalogue.treatments[0].source.boardId = 'shiplap-1x6-8';
    const input = toRateBookInput(values) as { catalogue: { treatments: { source: unknown }[] } };
    expect(input.catalogue.treatments[0]!.source).toEqual({ from: 'boards', boardId: 'shiplap-1x6-8' });
  });

  it('puts a message about a whole list on the list', async () => {
    const errors = await messagesFor((v) => (v.catalogue.treatments = []));
    expect(messageAt(errors, 'catalogue.treatments.root')).toBe('The catalogue needs at least one treatment.');
  });
});

describe('messages from the server', () => {
  it('are reworded into the unit the owner types where they use the stored one', () => {
    expect(displayMessage('materialMarkup', 'Material markup must be at most 3.')).toBe('Material markup must be at most 300 %.');
    expect(displayMessage('range.homeowner-tape.withPhotos.below', "Homeowner's tape with photos: below must be at most 0.9.")).toBe(
      "Homeowner's tape with photos: below must be at most 90 %.",
    );
    expect(displayMessage('catalogue.sheets.0.priceCents', 'Sheet price cannot be negative.')).toBe('Sheet price cannot be negative.');
    expect(displayMessage('catalogue.kerf', 'Saw kerf must be at most 0.5 in.')).toBe('Saw kerf must be at most 0.5 in.');
  });
});
