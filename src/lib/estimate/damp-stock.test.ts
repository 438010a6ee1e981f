import { describe, expect, it } from 'vitest';
import { fieldsOf } from './input-refusal.testing.ts';
import { estimate, parseRateBook, sampleRateBook, type ProjectInput, type RateBookInput } from './index.ts';

function bathroom(damp: boolean): ProjectInput {
  return {
    rooms: [
      {
        name: 'Bathroom',
        ceilingHeight: 96,
        walls: [{ label: 'Vanity wall', length: 96 }],
        treatment: { id: 'shiplap-vertical-ply', height: 'wainscot', wainscotHeight: 39.5 },
        damp,
      },
    ],
    builtBefore1978: 'no',
    measuredBy: 'site-measure',
  };
}

describe('damp rooms get damp-rated material', () => {
  // Source: docs/sources.md §10 — standard MDF and plywood swell where they get wet; moisture-resistant
  // stock (or solid wood, sealed) is the usual choice in bathrooms.
  it('prices the moisture-resistant strips the firm names for a damp bathroom, and says so', () => {
    const rb = parseRateBook(sampleRateBook());
    const dry = estimate(bathroom(false), rb);
    const damp = estimate(bathroom(true), rb);
    expect(dry.takeoff.materials.some((m) => m.id === 'sheet:ply-4x8-quarter')).toBe(true);
    expect(damp.takeoff.materials.some((m) => m.id === 'sheet:ply-4x8-quarter')).toBe(false);
    const mr = damp.takeoff.materials.find((m) => m.id === 'sheet:mr-mdf-4x8-half')!;
    expect(mr.unitCents).toBe(5600);
    expect(damp.takeoff.rooms[0]).toMatchObject({ treatmentId: 'shiplap-vertical-mr', dampAlternativeFor: 'shiplap-vertical-ply' });
    expect(damp.takeoff.notes.join(' ')).toMatch(/Bathroom is a damp room, so it is priced in vertical shiplap \(moisture-resistant mdf strips\)/);
    // The alternative's stock is moisture resistant, so the caution does not ask for a substitute.
    const caution = damp.takeoff.cautions.find((c) => c.id === 'damp-room')!;
    expect(caution.text).not.toMatch(/not listed as moisture resistant/);
    // Demo prices: the 1/2 in MR MDF sheet ($56) costs more than 1/4 in plywood ($32).
    expect(damp.price.materialsCents).toBeGreaterThan(dry.price.materialsCents);
  });

  it('only cautions when the firm names no alternative', () => {
    const input = sampleRateBook();
    input.catalogue.treatments = input.catalogue.treatments.map((t) => ({ ...t, dampRoomTreatmentId: undefined }));
    const damp = estimate(bathroom(true), parseRateBook(input));
    expect(damp.takeoff.rooms[0]!.treatmentId).toBe('shiplap-vertical-ply');
    expect(damp.takeoff.cautions.find((c) => c.id === 'damp-room')!.text).toMatch(/not listed as moisture resistant/);
  });

  it('refuses an alternative that is missing or of another kind, on the field', () => {
    const input: RateBookInput = sampleRateBook();
    input.catalogue.treatments[0] = { ...input.catalogue.treatments[0]!, dampRoomTreatmentId: 'beadboard' };
    expect(fieldsOf(() => parseRateBook(input))['rateBook.catalogue.treatments.0.dampRoomTreatmentId']).toMatch(/same kind of treatment/);
    input.catalogue.treatments[0] = { ...input.catalogue.treatments[0]!, dampRoomTreatmentId: 'nowhere' };
    expect(fieldsOf(() => parseRateBook(input))['rateBook.catalogue.treatments.0.dampRoomTreatmentId']).toMatch(/No treatment with id "nowhere"/);
  });
});
