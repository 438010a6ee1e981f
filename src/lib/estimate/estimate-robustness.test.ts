/**
 * Every project the schema accepts gets an answer: an estimate, or the core's typed input error with
 * the fields named (which the API turns into a 400). Nothing else may escape, or the homeowner
 * gets a 500 and cannot send an inquiry at all.
 */
import { fc, test as fcTest } from '@fast-check/vitest';
import { describe, expect } from 'vitest';
import { estimate, EstimateInputError, parseRateBook, projectSchema, sampleRateBook, type ProjectInput, type RateBookInput } from './index.ts';

const TREATMENTS = ['shiplap-vertical-ply', 'shiplap-horizontal', 'board-and-batten', 'beadboard', 'flat-panel', 'picture-frame'] as const;
const optional = <T>(arb: fc.Arbitrary<T>) => fc.option(arb, { nil: undefined });
/** Inches on the schema's own range, in sixteenths, sometimes at its ends. */
const inches = (min: number, max: number) =>
  fc.oneof(
    fc.constantFrom(min, max),
    fc.integer({ min: min * 16, max: max * 16 }).map((x) => x / 16),
  );

// Any value the schema takes, fields combined freely: most such projects fail the wall checks,
// which must then come back as field messages.
const anyOpening = fc.record(
  {
    kind: fc.constantFrom('door' as const, 'window' as const),
    count: fc.integer({ min: 1, max: 4 }),
    width: optional(inches(12, 240)),
    height: optional(inches(12, 144)),
    sillHeight: optional(inches(0, 120)),
    offset: optional(inches(0, 1200)),
  },
  { requiredKeys: ['kind'] },
);
const anyWall = fc.record(
  {
    label: fc.constantFrom('North', 'Wall by the stairs'),
    length: inches(12, 1200),
    side: fc.constantFrom('length' as const, 'width' as const),
    openings: fc.array(anyOpening, { maxLength: 3 }),
    outlets: fc.integer({ min: 0, max: 40 }),
    switches: fc.integer({ min: 0, max: 40 }),
  },
  { requiredKeys: [] },
);
const anyRoom = fc.record(
  {
    name: fc.constant('Room'),
    ceilingHeight: inches(60, 240),
    length: inches(24, 1200),
    width: inches(24, 1200),
    walls: fc.array(anyWall, { minLength: 1, maxLength: 3 }),
    insideCorners: fc.integer({ min: 0, max: 40 }),
    outsideCorners: fc.integer({ min: 0, max: 40 }),
    treatment: fc.record(
      { id: fc.constantFrom(...TREATMENTS), height: fc.constantFrom('wainscot' as const, 'full' as const), wainscotHeight: inches(18, 96) },
      { requiredKeys: ['id', 'height'] },
    ),
    replaceBaseboard: fc.boolean(),
    damp: fc.boolean(),
  },
  { requiredKeys: ['name', 'ceilingHeight', 'walls', 'treatment'] },
);

// Projects that also pass the wall checks: openings fit their wall and ceiling, placed ones do not overlap.
const unit = fc.double({ min: 0, max: 1, noNaN: true });
const openingShape = fc.record({
  kind: fc.constantFrom('door' as const, 'window' as const),
  count: fc.integer({ min: 1, max: 3 }),
  w: unit,
  h: unit,
  sill: unit,
  at: unit,
  placed: fc.boolean(),
});
type Shape = { kind: 'door' | 'window'; count: number; w: number; h: number; sill: number; at: number; placed: boolean };

function openingsFor(shapes: Shape[], length: number, ceiling: number, measured: boolean): ProjectInput['rooms'][number]['walls'][number]['openings'] {
  const list = shapes.map((o) => ({ ...o, count: measured && o.placed ? 1 : o.count }));
  const total = list.reduce((s, o) => s + o.count, 0);
  const slot = length / Math.max(1, total);
  if (!measured) return ceiling >= 80 && slot >= 36 ? list.map((o) => ({ kind: o.kind, count: o.count })) : [];
  if (slot < 12) return [];
  let cursor = 0;
  return list.map((o) => {
    const width = 12 + o.w * (Math.min(240, slot) - 12);
    const sillHeight = o.sill * Math.min(120, ceiling - 12);
    const height = 12 + o.h * (Math.min(144, ceiling - sillHeight) - 12);
    const at = cursor + o.at * (slot - width);
    cursor += slot * o.count;
    return { kind: o.kind, count: o.count, width, height, sillHeight, ...(o.placed ? { offset: at } : {}) };
  });
}

const validRoom = fc
  .record({
    ceilingHeight: inches(60, 240),
    length: inches(24, 1200),
    width: inches(24, 1200),
    treatment: fc.constantFrom(...TREATMENTS),
    height: fc.constantFrom('wainscot' as const, 'full' as const),
    wainscot: optional(unit),
    walls: fc.array(
      fc.record({
        by: fc.constantFrom('length' as const, 'side-length' as const, 'side-width' as const),
        length: inches(12, 1200),
        measured: fc.boolean(),
        openings: fc.array(openingShape, { maxLength: 4 }),
        outlets: fc.integer({ min: 0, max: 40 }),
        switches: fc.integer({ min: 0, max: 40 }),
      }),
      { minLength: 1, maxLength: 4 },
    ),
    replaceBaseboard: fc.boolean(),
    damp: fc.boolean(),
  })
  .map((r) => ({
    name: 'Room',
    ceilingHeight: r.ceilingHeight,
    length: r.length,
    width: r.width,
    treatment: {
      id: r.treatment,
      height: r.height,
      // Between 18 in and 6-1/2 in below the ceiling; left out, it is a third of the ceiling height.
      ...(r.height === 'wainscot' && r.wainscot !== undefined ? { wainscotHeight: 18 + r.wainscot * (Math.min(96, r.ceilingHeight - 6.5) - 18) } : {}),
    },
    walls: r.walls.map((w) => {
      const length = w.by === 'length' ? w.length : w.by === 'side-length' ? r.length : r.width;
      const where = w.by === 'length' ? { length } : { side: w.by === 'side-length' ? ('length' as const) : ('width' as const) };
      return { ...where, openings: openingsFor(w.openings, length, r.ceilingHeight, w.measured), outlets: w.outlets, switches: w.switches };
    }),
    replaceBaseboard: r.replaceBaseboard,
    damp: r.damp,
  }));

const projectOf = <R>(rooms: fc.Arbitrary<R[]>) =>
  fc.record(
    {
      rooms,
      paint: fc.boolean(),
      builtBefore1978: fc.constantFrom('yes' as const, 'no' as const, 'not-sure' as const),
      measuredBy: fc.constantFrom('homeowner-estimate' as const, 'homeowner-tape' as const, 'site-measure' as const),
      photoCount: fc.integer({ min: 0, max: 100 }),
      tripZone: fc.constantFrom('local', 'outer'),
    },
    { requiredKeys: ['rooms', 'builtBefore1978', 'measuredBy'] },
  ) as fc.Arbitrary<ProjectInput>;

export const validProject = projectOf(fc.array(validRoom, { minLength: 1, maxLength: 3 }));
const anyProject = projectOf(fc.array(anyRoom, { minLength: 1, maxLength: 3 }));

/** The sample rate book with the sizes that shape a layout moved anywhere in their schema range. */
const rateBook: fc.Arbitrary<RateBookInput> = fc
  .record({
    mouldingLength: inches(24, 240),
    thickness: inches(0.125, 2),
    targetFrameWidth: inches(6, 96),
    margin: inches(1, 24),
    frameGap: inches(1, 24),
    rows: fc.integer({ min: 1, max: 4 }),
    boardLength: inches(24, 240),
    stripWidth: inches(1, 24),
    gap: inches(0, 1),
    battenSpacing: inches(6, 96),
    stileSpacing: inches(8, 96),
    kerf: inches(0, 0.5),
  })
  .map((v) => {
    const rb = sampleRateBook();
    const c = rb.catalogue;
    c.kerf = v.kerf;
    for (const m of c.mouldings) Object.assign(m, { length: v.mouldingLength, thickness: v.thickness });
    for (const b of c.boards) b.length = v.boardLength;
    for (const t of c.treatments) {
      if (t.kind === 'picture-frame')
        Object.assign(t, { targetFrameWidth: v.targetFrameWidth, margin: v.margin, frameGap: v.frameGap, fullHeightRows: v.rows });
      if (t.kind === 'shiplap') {
        t.gap = v.gap;
        if (t.source.from === 'sheet') t.source.stripWidth = v.stripWidth;
      }
      if (t.kind === 'board-and-batten') t.battenSpacing = v.battenSpacing;
      if (t.kind === 'flat-panel') t.stileSpacing = v.stileSpacing;
    }
    return rb;
  });

function answersOrRefuses(project: ProjectInput, rb: unknown): void {
  expect(projectSchema.safeParse(project).success).toBe(true);
  try {
    const e = estimate(project, rb);
    expect(e.price.lowCents).toBeLessThanOrEqual(e.price.highCents);
  } catch (error) {
    if (!(error instanceof EstimateInputError)) throw error;
    expect(Object.keys(error.fields).length).toBeGreaterThan(0);
  }
}

describe('estimate() over every valid project', () => {
  const sample = parseRateBook(sampleRateBook());

  fcTest.prop([validProject], { numRuns: 400 })('answers with an estimate or a typed input error, with the sample rate book', (project) => {
    answersOrRefuses(project, sample);
  });

  fcTest.prop([validProject, rateBook], { numRuns: 300 })('and with layout sizes anywhere in the rate book range', (project, rb) => {
    answersOrRefuses(project, rb);
  });

  fcTest.prop([anyProject], { numRuns: 300 })('and for any combination of fields the schema takes', (project) => {
    answersOrRefuses(project, sample);
  });
});
