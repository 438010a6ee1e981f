/**
 * The two inputs of an estimate, as zod schemas: the project (what a homeowner or staff member
 * describes; also the body of POST /api/embed/SLUG/estimate) and the rate book (the owner's numbers,
 * including the catalogue of treatments the firm offers). Lengths are inches, areas square feet,
 * money integer cents. Objects are strict: unknown keys are refused.
 */
import { z } from 'zod';
import { DRESSED_SIZES, NOMINAL_SIZES, type NominalSize } from './lumber.ts';
import { stairSchema } from './stair-wall.ts';

// ---------------------------------------------------------------------------------------------
// Building blocks with messages that name the field.

function num(label: string, unit: string, min: number, max: number) {
  return z
    .number({ error: (iss) => (iss.input === undefined ? `${label} is required.` : `${label} must be a number${unit ? ` (${unit})` : ''}.`) })
    .min(min, { error: `${label} must be at least ${min}${unit ? ` ${unit}` : ''}.` })
    .max(max, { error: `${label} must be at most ${max}${unit ? ` ${unit}` : ''}.` });
}
const inches = (label: string, min: number, max: number) => num(label, 'in', min, max);
function count(label: string, max: number) {
  return z
    .number({ error: (iss) => (iss.input === undefined ? `${label} is required.` : `${label} must be a whole number.`) })
    .int({ error: `${label} must be a whole number.` })
    .min(0, { error: `${label} cannot be negative.` })
    .max(max, { error: `${label} must be at most ${max}.` });
}
function cents(label: string, max = 100_000_000) {
  return z
    .number({ error: (iss) => (iss.input === undefined ? `${label} is required.` : `${label} must be a whole number of cents.`) })
    .int({ error: `${label} must be a whole number of cents.` })
    .min(0, { error: `${label} cannot be negative.` })
    .max(max, { error: `${label} is too large.` });
}
const fraction = (label: string, max: number) => num(label, '', 0, max);
function text(label: string, max: number) {
  return z
    .string({ error: (iss) => (iss.input === undefined ? `${label} is required.` : `${label} must be text.`) })
    .trim()
    .min(1, { error: `${label} cannot be empty.` })
    .max(max, { error: `${label} must be at most ${max} characters.` });
}
const slug = (label: string) => text(label, 60).regex(/^[a-z0-9][a-z0-9-]*$/, { error: `${label} must use lowercase letters, digits and dashes.` });
function choice<const T extends readonly [string, ...string[]]>(label: string, values: T) {
  return z.enum(values, { error: `${label} must be one of: ${values.join(', ')}.` });
}
const flag = (label: string) => z.boolean({ error: `${label} must be true or false.` });

// ---------------------------------------------------------------------------------------------
// Project (the homeowner's or staff member's description)

export const OPENING_KINDS = ['door', 'window'] as const;
export const MEASURED_BY = ['homeowner-estimate', 'homeowner-tape', 'site-measure'] as const;
export const BUILT_BEFORE_1978 = ['yes', 'no', 'not-sure'] as const;
export const TREATMENT_HEIGHTS = ['wainscot', 'full'] as const;
export const FIXTURE_KINDS = ['tub', 'shower', 'vanity', 'toilet', 'radiator', 'built-in'] as const;
export type FixtureKind = (typeof FIXTURE_KINDS)[number];

/** A fixture that takes wall length; sizes and whether the treatment stops at it are in fixtures.ts. */
export const fixtureSchema = z.strictObject({
  kind: choice('Fixture kind', FIXTURE_KINDS),
  width: inches('Fixture width', 6, 240).optional(),
  height: inches('Fixture height', 6, 144).optional(),
  /** Distance from the wall's left end to the fixture's left edge; set from the left end when left out. */
  offset: inches('Fixture distance from the left end', 0, 1200).optional(),
});

export const openingSchema = z.strictObject({
  kind: choice('Opening kind', OPENING_KINDS),
  /** How many identical openings this entry stands for (for homeowners who only count them). */
  count: count('Number of openings', 20).min(1, { error: 'Number of openings must be at least 1.' }).default(1),
  width: inches('Opening width', 12, 240).optional(),
  height: inches('Opening height', 12, 144).optional(),
  sillHeight: inches('Sill height', 0, 120).optional(),
  /** Distance from the wall's left end to the opening's left edge; set from the left end when left out. */
  offset: inches('Distance from the left end', 0, 1200).optional(),
  /** Width of the casing around this opening, when it differs from the rate book's (0 = no casing). */
  casingWidth: inches('Casing width', 0, 12).optional(),
});

export const wallSchema = z.strictObject({
  label: text('Wall name', 40).optional(),
  /** The wall's length; or `side` to take it from the room's length or width. */
  length: inches('Wall length', 12, 1200).optional(),
  side: choice('Wall side', ['length', 'width'] as const).optional(),
  openings: z.array(openingSchema, { error: 'Openings must be a list.' }).max(16, { error: 'At most 16 openings per wall.' }).default([]),
  outlets: count('Number of outlets', 40).default(0),
  switches: count('Number of switches', 40).default(0),
  fixtures: z.array(fixtureSchema, { error: 'Fixtures must be a list.' }).max(8, { error: 'At most 8 fixtures per wall.' }).default([]),
  /** A stair runs along this wall: the band follows its nosing line (stair-wall.ts). Left out: a level wall. */
  stair: stairSchema.optional(),
});

export const roomTreatmentSchema = z.strictObject({
  id: slug('Treatment'),
  height: choice('Treatment height', TREATMENT_HEIGHTS),
  /** Top of the wainscot (under the cap rail); one third of the ceiling height when left out. */
  wainscotHeight: inches('Wainscot height', 18, 96).optional(),
});

export const roomSchema = z.strictObject({
  name: text('Room name', 60),
  ceilingHeight: inches('Ceiling height', 60, 240),
  /** Room length and width, for walls given by `side`. */
  length: inches('Room length', 24, 1200).optional(),
  width: inches('Room width', 24, 1200).optional(),
  walls: z
    .array(wallSchema, { error: 'Walls must be a list.' })
    .min(1, { error: 'Add at least one wall to cover.' })
    .max(16, { error: 'At most 16 walls per room.' }),
  insideCorners: count('Inside corners', 40).optional(),
  outsideCorners: count('Outside corners', 40).optional(),
  treatment: roomTreatmentSchema,
  replaceBaseboard: flag('Replace baseboard').default(false),
  /** Bathroom, laundry or another room that gets damp. */
  damp: flag('Damp room').default(false),
});

export const projectSchema = z.strictObject({
  rooms: z
    .array(roomSchema, { error: 'Rooms must be a list.' })
    .min(1, { error: 'Add at least one room.' })
    .max(20, { error: 'At most 20 rooms per estimate.' }),
  /** Whether the firm primes and paints the new work. */
  paint: flag('Painting').default(false),
  builtBefore1978: choice('Built before 1978', BUILT_BEFORE_1978),
  measuredBy: choice('How the walls were measured', MEASURED_BY),
  photoCount: count('Number of photos', 100).default(0),
  /** One of the rate book's trip zones; none means no trip fee. */
  tripZone: slug('Trip zone').optional(),
});

export type ProjectInput = z.input<typeof projectSchema>;
export type Project = z.output<typeof projectSchema>;
export type Room = Project['rooms'][number];
export type Wall = Room['walls'][number];
export type Opening = Wall['openings'][number];
export type MeasuredBy = (typeof MEASURED_BY)[number];

// ---------------------------------------------------------------------------------------------
// Rate book: stock, supplies, treatments, labour, extras, range.

const stockId = (label: string) => slug(label);

export const sheetStockSchema = z.strictObject({
  id: stockId('Sheet id'),
  name: text('Sheet name', 80),
  width: inches('Sheet width', 12, 72),
  height: inches('Sheet length', 24, 144),
  thickness: inches('Sheet thickness', 0.0625, 1.5),
  priceCents: cents('Sheet price'),
  moistureResistant: flag('Moisture resistant').default(false),
});

export const boardStockSchema = z
  .strictObject({
    id: stockId('Board id'),
    name: text('Board name', 80),
    /** A nominal size such as 1x6; its dressed width and thickness come from PS 20. */
    nominal: choice('Nominal size', NOMINAL_SIZES as unknown as [NominalSize, ...NominalSize[]]).optional(),
    width: inches('Board width', 0.5, 12).optional(),
    thickness: inches('Board thickness', 0.125, 2).optional(),
    /** Width that shows once boards overlap (milled shiplap); the full width when left out. */
    faceWidth: inches('Board face width', 0.5, 12).optional(),
    length: inches('Stock length', 24, 240),
    priceCents: cents('Board price'),
    moistureResistant: flag('Moisture resistant').default(false),
  })
  .superRefine((b, ctx) => {
    if (b.nominal === undefined && (b.width === undefined || b.thickness === undefined)) {
      ctx.addIssue({ code: 'custom', path: ['width'], message: 'Give a nominal size (such as 1x6) or both the actual width and thickness.' });
    }
    const width = b.width ?? (b.nominal ? DRESSED_SIZES[b.nominal].width : 0);
    if (b.faceWidth !== undefined && b.faceWidth > width) {
      ctx.addIssue({ code: 'custom', path: ['faceWidth'], message: 'Board face width cannot be more than the board width.' });
    }
  })
  .transform((b) => {
    const dressed = b.nominal ? DRESSED_SIZES[b.nominal] : undefined;
    const width = b.width ?? dressed!.width;
    const thickness = b.thickness ?? dressed!.thickness;
    return { ...b, width, thickness, faceWidth: b.faceWidth ?? width };
  });

export const mouldingStockSchema = z
  .strictObject({
    id: stockId('Moulding id'),
    name: text('Moulding name', 80),
    /** Face height of the moulding as it sits on the wall. */
    width: inches('Moulding width', 0.5, 12),
    thickness: inches('Moulding thickness', 0.125, 2),
    length: inches('Stock length', 24, 240),
    priceCents: cents('Moulding price'),
    /**
     * The same profile sold in longer lengths, each at its own price. A cut longer than `length` comes
     * from the shortest of these that fits; one longer than all of them is joined.
     */
    longerLengths: z
      .array(z.strictObject({ length: inches('Longer stock length', 24, 240), priceCents: cents('Longer stock price') }), {
        error: 'Longer lengths must be a list.',
      })
      .max(5, { error: 'At most 5 longer lengths per moulding.' })
      .default([]),
  })
  .superRefine((m, ctx) => {
    const seen = new Set<number>([m.length]);
    m.longerLengths.forEach((l, i) => {
      if (l.length <= m.length)
        ctx.addIssue({ code: 'custom', path: ['longerLengths', i, 'length'], message: 'A longer length must be longer than the stock length.' });
      else if (seen.has(l.length)) ctx.addIssue({ code: 'custom', path: ['longerLengths', i, 'length'], message: 'This length is listed twice.' });
      seen.add(l.length);
    });
  });

const tubeSchema = (label: string) =>
  z.strictObject({
    name: text(`${label} name`, 80),
    fluidOunces: num(`${label} tube size`, 'fl oz', 1, 64),
    /** Bead size: the leg of a triangular caulk fillet, or the diameter of a round adhesive bead. */
    bead: inches(`${label} bead size`, 0.0625, 1),
    priceCents: cents(`${label} price`),
  });

const coatingSchema = (label: string) =>
  z.strictObject({
    name: text(`${label} name`, 80),
    sqFtPerGallon: num(`${label} coverage`, 'sq ft per gallon', 50, 1000),
    coats: count(`${label} coats`, 4),
    priceCents: cents(`${label} price per gallon`),
    /**
     * The sizes the store sells, each in US gallons at its own price; the cheapest mix that covers is
     * bought (containers.ts). Left out: the one-gallon price above is the only size.
     */
    containers: z
      .array(
        z.strictObject({
          name: text(`${label} container name`, 40),
          gallons: num(`${label} container size`, 'US gallons', 0.0625, 10),
          priceCents: cents(`${label} container price`),
        }),
        { error: `${label} containers must be a list.` },
      )
      .min(1, { error: `List at least one ${label.toLowerCase()} container, or leave the list out.` })
      .max(6, { error: `At most 6 ${label.toLowerCase()} containers.` })
      .optional(),
  });

export const suppliesSchema = z.strictObject({
  brads: z.strictObject({
    name: text('Brad name', 80),
    perBox: count('Brads per box', 100_000).min(1, { error: 'Brads per box must be at least 1.' }),
    perSqFt: num('Brads per sq ft of panelling', '', 0, 20),
    perFootOfTrim: num('Brads per foot of trim', '', 0, 20),
    priceCents: cents('Brad box price'),
    /**
     * Brad lengths the firm stocks. Each fixing takes the shortest that is long enough for it
     * (brad-sizes.ts); without a list, the brad above is used for everything.
     */
    sizes: z
      .array(
        z.strictObject({
          name: text('Brad size name', 80),
          length: inches('Brad length', 0.25, 4),
          perBox: count('Brads per box', 100_000).min(1, { error: 'Brads per box must be at least 1.' }),
          priceCents: cents('Brad box price'),
        }),
        { error: 'Brad sizes must be a list.' },
      )
      .max(10, { error: 'At most 10 brad sizes.' })
      .default([]),
  }),
  adhesive: tubeSchema('Adhesive').extend({
    /** House rule for how much bead goes behind each square foot of boards or sheets. */
    feetPerSqFt: num('Adhesive bead per sq ft', 'ft', 0, 10),
  }),
  caulk: tubeSchema('Caulk'),
  filler: z.strictObject({ name: text('Filler name', 80), sqFtPerUnit: num('Filler coverage', 'sq ft', 1, 10_000), priceCents: cents('Filler price') }),
  primer: coatingSchema('Primer'),
  paint: coatingSchema('Paint'),
  boxExtender: z.strictObject({ name: text('Box extender name', 80), priceCents: cents('Box extender price') }),
});

const treatmentCommon = {
  id: slug('Treatment id'),
  name: text('Treatment name', 80),
  enabled: flag('Offered'),
  /** Installation productivity for this treatment. */
  sqFtPerHour: num('Productivity', 'sq ft per hour', 1, 500),
  /** Whether the material needs a coat of primer before paint (raw wood or MDF). */
  needsPrimer: flag('Needs primer').default(true),
  /** Painting time relative to a flat face (grooves and gaps take longer): the paint rate is divided by it. */
  paintFactor: num('Painting factor', '', 0.5, 4).default(1),
  /**
   * How boards, strips and sheets are set out across the wall: from the left end (the last one
   * ripped to fit) or balanced (both ends ripped to the same width; see balanced-run.ts).
   */
  layout: choice('Layout', ['from-left', 'balanced'] as const).default('from-left'),
  /**
   * The finish used instead in a room marked damp: another treatment of the same kind in the
   * catalogue, made with moisture-resistant stock (it may be switched off for ordinary rooms).
   */
  dampRoomTreatmentId: slug('Treatment for damp rooms').optional(),
  /** Narrowest end board the owner accepts in a balanced layout; common practice, no source (about 1-1/2 in). */
  minEndWidth: inches('Narrowest end board', 0.25, 12).default(1.5),
};

export const shiplapSchema = z.strictObject({
  ...treatmentCommon,
  kind: z.literal('shiplap'),
  orientation: choice('Board direction', ['vertical', 'horizontal'] as const),
  source: z.discriminatedUnion(
    'from',
    [
      z.strictObject({ from: z.literal('sheet'), sheetId: stockId('Sheet'), stripWidth: inches('Strip width', 1, 24) }),
      z.strictObject({ from: z.literal('boards'), boardId: stockId('Board') }),
    ],
    { error: 'Material source must be "sheet" (strips ripped from sheets) or "boards".' },
  ),
  /** Reveal between boards. */
  gap: inches('Gap between boards', 0, 1),
});

export const boardAndBattenSchema = z.strictObject({
  ...treatmentCommon,
  kind: z.literal('board-and-batten'),
  battenId: stockId('Batten'),
  /** Greatest centre-to-centre spacing; battens are spread evenly and sit at both wall ends. */
  battenSpacing: inches('Batten spacing', 6, 96),
  topRailId: stockId('Top rail').optional(),
  /** A sheet behind the battens; without one the battens go on the painted wall. */
  backingSheetId: stockId('Backing sheet').optional(),
});

export const beadboardSchema = z.strictObject({
  ...treatmentCommon,
  kind: z.literal('beadboard'),
  sheetId: stockId('Beadboard panel'),
});

export const flatPanelSchema = z.strictObject({
  ...treatmentCommon,
  kind: z.literal('flat-panel'),
  stileId: stockId('Stile'),
  railId: stockId('Rail'),
  stileSpacing: inches('Stile spacing', 8, 96),
  backingSheetId: stockId('Backing sheet').optional(),
});

export const pictureFrameSchema = z.strictObject({
  ...treatmentCommon,
  kind: z.literal('picture-frame'),
  mouldingId: stockId('Frame moulding'),
  /** Space between a frame and the baseboard, cap rail, wall end or opening. */
  margin: inches('Frame margin', 1, 24),
  /** Space between neighbouring frames. */
  frameGap: inches('Space between frames', 1, 24),
  /** Frame width aimed for; frames are then sized to fill each stretch of wall evenly. */
  targetFrameWidth: inches('Target frame width', 6, 96),
  /** Rows of frames on a full-height wall (a wainscot always has one). */
  fullHeightRows: count('Rows of frames', 4).min(1, { error: 'Rows of frames must be at least 1.' }).default(2),
});

export const treatmentSchema = z.discriminatedUnion('kind', [shiplapSchema, boardAndBattenSchema, beadboardSchema, flatPanelSchema, pictureFrameSchema], {
  error: 'Treatment kind must be one of: shiplap, board-and-batten, beadboard, flat-panel, picture-frame.',
});

export const catalogueSchema = z.strictObject({
  /** Fraction added to field material (sheets, boards, mouldings) for offcuts, defects and mistakes. */
  wasteFactor: fraction('Waste factor', 0.5),
  /**
   * Fraction added for defects to quantities that come from an exact cutting layout (which get no waste
   * factor: their offcuts are already counted). Estimated quantities keep the waste factor. Default 0.
   */
  defectAllowance: fraction('Defect allowance', 0.5).default(0),
  /** Stud spacing on centre, for joints in horizontal boards and rails: 16 in unless given (docs/sources.md §45). */
  studSpacing: inches('Stud spacing', 12, 24).default(16),
  /** Saw kerf lost at each cut. */
  kerf: inches('Saw kerf', 0, 0.5),
  /** Added to each end of a cap rail or baseboard cut for miters and fitting. */
  trimEndAllowance: inches('Trim end allowance', 0, 12),
  sheets: z.array(sheetStockSchema).max(50),
  boards: z.array(boardStockSchema).max(50),
  mouldings: z.array(mouldingStockSchema).max(50),
  baseboardId: stockId('Baseboard'),
  capRailId: stockId('Cap rail'),
  /**
   * The board or moulding run along the rake on a stair wall (a skirt board); the baseboard stands in
   * when left out (docs/sources.md §43).
   */
  skirtBoardId: stockId('Skirt board').optional(),
  /** A moulding run around a casing's outside edge where the new work stands proud of it (docs/sources.md §31). */
  backBandId: stockId('Back band').optional(),
  /**
   * The casing usually found around doors and windows: its width stops the treatment short of the
   * opening, its thickness is the face the new work must stay behind. Default 2-1/4 × 11/16 in:
   * from memory, docs/sources.md §30.
   */
  /**
   * Thickness of the baseboard already on the walls: where the new work would stand proud of it, the
   * baseboard is taken off and reset on the new face (build-up.ts). Default 1/2 in: from memory.
   */
  existingBaseboardThickness: inches('Existing baseboard thickness', 0, 2).default(0.5),
  /**
   * How far the existing window stools (the sill's inside ledge) stand out from the wall face: where the
   * new work plus the apron reset on it would come past it, the stool and apron are refitted
   * (window-stool.ts). Default 1-1/2 in: from memory, docs/sources.md §51.
   */
  stoolProjection: inches('Window stool projection', 0, 6).default(1.5),
  casing: z.strictObject({ width: inches('Casing width', 0, 12), thickness: inches('Casing thickness', 0, 2) }).default({ width: 2.25, thickness: 0.6875 }),
  /** Mouldings set in each inside and outside corner, the band's height; none when left out. */
  insideCornerTrimId: stockId('Inside corner trim').optional(),
  outsideCornerTrimId: stockId('Outside corner trim').optional(),
  supplies: suppliesSchema,
  treatments: z.array(treatmentSchema).min(1, { error: 'The catalogue needs at least one treatment.' }).max(50),
});

const spreadSchema = (label: string) => z.strictObject({ below: fraction(`${label}: below`, 0.9), above: fraction(`${label}: above`, 3) });
const methodSpreadSchema = (label: string) =>
  z.strictObject({ withPhotos: spreadSchema(`${label} with photos`), withoutPhotos: spreadSchema(`${label} without photos`) });

/**
 * How much each reason counts towards an inquiry's triage score (points; the score is scaled to 0–100
 * by their sum). Defaults until the rate book has a screen for them; the numbers are our own starting
 * point (common practice, no source): a job in the area, of a worthwhile size, described with photos
 * and a tape, answered on time.
 */
export const triageWeightsSchema = z.strictObject({
  serviceArea: num('Points for being inside the service area', '', 0, 100).default(20),
  jobSize: num('Points for the size of the job', '', 0, 100).default(25),
  /** The covered area that earns all the size points; smaller jobs earn their share. */
  fullSizeSqFt: num('Covered area that earns all the size points', 'sq ft', 1, 100_000).default(300),
  photos: num('Points for photos', '', 0, 100).default(15),
  /** Photos that earn all the photo points. */
  fullPhotos: count('Photos that earn all the photo points', 10).min(1, { error: 'At least one photo.' }).default(3),
  measurement: num('Points for how the walls were measured', '', 0, 100).default(15),
  response: num('Points for answering within the response target', '', 0, 100).default(25),
});
export type TriageWeights = z.output<typeof triageWeightsSchema>;
export const DEFAULT_TRIAGE_WEIGHTS: TriageWeights = triageWeightsSchema.parse({});

export const rateBookSchema = z
  .strictObject({
    units: choice('Units', ['imperial', 'metric'] as const),
    currency: z.string().regex(/^[A-Z]{3}$/, { error: 'Currency must be a three-letter ISO 4217 code such as USD.' }),
    locale: text('Locale', 35).default('en-US'),
    catalogue: catalogueSchema,
    materialMarkup: fraction('Material markup', 3),
    labour: z.strictObject({
      rateCents: cents('Labour rate per hour', 1_000_000),
      hoursPerCutOut: num('Time per cut-out', 'hours', 0, 8),
      hoursPerReturn: num('Time per window or door return', 'hours', 0, 8),
      hoursPerCorner: num('Time per corner', 'hours', 0, 8),
      hoursPerFootBaseboardRemoved: num('Time per foot of baseboard removed', 'hours', 0, 2),
      hoursPerFootBaseboardInstalled: num('Time per foot of baseboard installed', 'hours', 0, 2),
      hoursPerFootCapRail: num('Time per foot of cap rail', 'hours', 0, 2),
      hoursPerFootBackBand: num('Time per foot of back band', 'hours', 0, 2).default(0),
      /** Marking, cutting and fitting one end cut to the stair's angle (docs/sources.md §43; common practice, no source). */
      hoursPerRakeCut: num('Time per rake cut', 'hours', 0, 2).default(0.1),
      /** Taking off and refitting one window's stool and apron (extended, re-cut or replaced) where the new work stands proud of it. */
      hoursPerStoolRefit: num('Time per window stool refit', 'hours', 0, 24).default(0),
      paintSqFtPerHour: num('Painting productivity', 'sq ft per hour', 1, 1000),
      /** Older rate books charged set-up per room; kept so they still parse, and used when the per-visit figure is missing. */
      setupHoursPerRoom: num('Set-up and clean-up per room', 'hours', 0, 24).optional(),
      /** Set-up and clean-up on each site visit (install days, caulk and fill, each coat). */
      setupHoursPerVisit: num('Set-up and clean-up per visit', 'hours', 0, 24).optional(),
      /** Working hours in one install day, for counting install visits. */
      hoursPerDay: num('Working hours per day', 'hours', 1, 24).default(8),
      /** Time per fixture, by kind: remove and reset (toilet, radiator) or scribe to it (the others). */
      hoursPerFixture: z
        .strictObject(
          Object.fromEntries(FIXTURE_KINDS.map((k) => [k, num(`Time per fixture (${k})`, 'hours', 0, 24).optional()])) as Record<
            FixtureKind,
            z.ZodOptional<ReturnType<typeof num>>
          >,
        )
        .default({}),
    }),
    extras: z.strictObject({
      leadSafe: z.strictObject({
        perJobCents: cents('Lead-safe set-up per job'),
        perRoomCents: cents('Lead-safe set-up per room'),
        /** Charge it on every pre-1978 job, not only when painted surfaces are disturbed beyond the minor-repair limit. */
        everyPre1978Job: flag('Charge lead-safe set-up on every pre-1978 job'),
      }),
      highCeiling: z.strictObject({
        aboveHeight: inches('High-ceiling threshold', 60, 240),
        perRoomCents: cents('High-ceiling charge per room'),
      }),
      tripZones: z.array(z.strictObject({ id: slug('Trip zone id'), name: text('Trip zone name', 60), feeCents: cents('Trip fee') })).max(20),
    }),
    taxRate: fraction('Tax rate', 0.5),
    taxOn: choice('Tax applies to', ['materials', 'everything'] as const),
    minimumJobCents: cents('Minimum job'),
    /** Low is rounded down and high up to a multiple of this. */
    roundingCents: cents('Rounding step').min(1, { error: 'Rounding step must be at least 1 cent.' }),
    range: z.strictObject({
      'homeowner-estimate': methodSpreadSchema("Homeowner's estimate"),
      'homeowner-tape': methodSpreadSchema("Homeowner's tape"),
      'site-measure': methodSpreadSchema('Site measurement'),
    }),
    /** Settings of the staff area rather than prices; optional, so every stored rate book still parses. */
    triage: triageWeightsSchema.optional(),
  })
  .superRefine((rb, ctx) => {
    if (rb.labour.setupHoursPerVisit === undefined && rb.labour.setupHoursPerRoom === undefined) {
      ctx.addIssue({ code: 'custom', path: ['labour', 'setupHoursPerVisit'], message: 'Set-up and clean-up per visit is required.' });
    }
    const c = rb.catalogue;
    const sheets = new Set(c.sheets.map((s) => s.id));
    const boards = new Set(c.boards.map((s) => s.id));
    const mouldings = new Set(c.mouldings.map((s) => s.id));
    const need = (set: Set<string>, id: string | undefined, path: PropertyKey[], what: string): void => {
      if (id !== undefined && !set.has(id)) ctx.addIssue({ code: 'custom', path, message: `No ${what} with id "${id}" in the catalogue.` });
    };
    const unique = (ids: string[], path: string, what: string): void => {
      const seen = new Set<string>();
      ids.forEach((id, i) => {
        if (seen.has(id)) ctx.addIssue({ code: 'custom', path: ['catalogue', path, i, 'id'], message: `Two ${what} share the id "${id}".` });
        seen.add(id);
      });
    };
    unique(
      c.sheets.map((s) => s.id),
      'sheets',
      'sheets',
    );
    unique(
      c.boards.map((s) => s.id),
      'boards',
      'boards',
    );
    unique(
      c.mouldings.map((s) => s.id),
      'mouldings',
      'mouldings',
    );
    unique(
      c.treatments.map((s) => s.id),
      'treatments',
      'treatments',
    );
    unique(
      rb.extras.tripZones.map((s) => s.id),
      'tripZones',
      'trip zones',
    );
    need(mouldings, c.baseboardId, ['catalogue', 'baseboardId'], 'moulding');
    need(mouldings, c.capRailId, ['catalogue', 'capRailId'], 'moulding');
    need(mouldings, c.backBandId, ['catalogue', 'backBandId'], 'moulding');
    if (c.skirtBoardId !== undefined && !boards.has(c.skirtBoardId) && !mouldings.has(c.skirtBoardId))
      ctx.addIssue({ code: 'custom', path: ['catalogue', 'skirtBoardId'], message: `No board or moulding with id "${c.skirtBoardId}" in the catalogue.` });
    need(mouldings, c.insideCornerTrimId, ['catalogue', 'insideCornerTrimId'], 'moulding');
    need(mouldings, c.outsideCornerTrimId, ['catalogue', 'outsideCornerTrimId'], 'moulding');
    c.treatments.forEach((t, i) => {
      const p = (k: string): PropertyKey[] => ['catalogue', 'treatments', i, k];
      if (t.dampRoomTreatmentId !== undefined) {
        const alt = c.treatments.find((x) => x.id === t.dampRoomTreatmentId);
        if (!alt)
          ctx.addIssue({ code: 'custom', path: p('dampRoomTreatmentId'), message: `No treatment with id "${t.dampRoomTreatmentId}" in the catalogue.` });
        else if (alt.id === t.id)
          ctx.addIssue({ code: 'custom', path: p('dampRoomTreatmentId'), message: 'A treatment cannot be its own damp-room alternative.' });
        else if (alt.kind !== t.kind)
          ctx.addIssue({
            code: 'custom',
            path: p('dampRoomTreatmentId'),
            message: `The damp-room alternative must be the same kind of treatment (${t.kind}).`,
          });
      }
      switch (t.kind) {
        case 'shiplap':
          if (t.source.from === 'sheet') {
            need(sheets, t.source.sheetId, [...p('source'), 'sheetId'], 'sheet');
            const { sheetId, stripWidth } = t.source;
            const sheet = c.sheets.find((s) => s.id === sheetId);
            if (sheet && stripWidth > Math.min(sheet.width, sheet.height)) {
              ctx.addIssue({ code: 'custom', path: [...p('source'), 'stripWidth'], message: 'Strip width is wider than the sheet.' });
            }
          } else need(boards, t.source.boardId, [...p('source'), 'boardId'], 'board');
          break;
        case 'board-and-batten':
          need(boards, t.battenId, p('battenId'), 'board');
          need(boards, t.topRailId, p('topRailId'), 'board');
          need(sheets, t.backingSheetId, p('backingSheetId'), 'sheet');
          break;
        case 'beadboard':
          need(sheets, t.sheetId, p('sheetId'), 'sheet');
          break;
        case 'flat-panel':
          need(boards, t.stileId, p('stileId'), 'board');
          need(boards, t.railId, p('railId'), 'board');
          need(sheets, t.backingSheetId, p('backingSheetId'), 'sheet');
          break;
        case 'picture-frame':
          need(mouldings, t.mouldingId, p('mouldingId'), 'moulding');
          break;
      }
    });
  });

export type RateBookInput = z.input<typeof rateBookSchema>;
export type RateBook = z.output<typeof rateBookSchema>;
export type Catalogue = RateBook['catalogue'];
export type Treatment = Catalogue['treatments'][number];
export type TreatmentKind = Treatment['kind'];
export type SheetStock = Catalogue['sheets'][number];
export type BoardStock = Catalogue['boards'][number];
export type MouldingStock = Catalogue['mouldings'][number];
