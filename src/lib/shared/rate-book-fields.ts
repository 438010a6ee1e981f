/**
 * Every number and choice of a Rate book, described once for the screens that edit it: where it sits
 * in the stored rate book (a path pattern, `*` standing for a row of a list), what the owner calls it,
 * its unit, a help line, and how it is entered. Grouped in the order an owner thinks about the firm's
 * numbers. No React here: the editor's islands, its resolver and its tests all read this one list.
 *
 * The stored shape is the estimating core's `rateBookSchema`; a unit test walks that schema and the
 * demo rate book and fails when a field has no descriptor here, or a descriptor names no field.
 */
import type { TreatmentKind } from '~/lib/estimate';

/**
 * How a field is entered. `money` is typed in the firm's currency and stored as integer cents;
 * `percent` is typed as a percentage and stored as a fraction; `reference` picks the id of a sheet,
 * board, moulding or treatment of the same rate book. The others are stored as typed.
 */
export type FieldKind = 'money' | 'percent' | 'hours' | 'inches' | 'count' | 'number' | 'text' | 'choice' | 'flag' | 'reference';

/** The lists a reference may pick from. */
export type ReferenceList = 'sheets' | 'boards' | 'mouldings' | 'treatments';

export type GroupId = 'materials' | 'finishes' | 'labour' | 'extras' | 'pricing' | 'range' | 'triage';

export type FieldDescriptor = {
  kind: FieldKind;
  /** Dotted path in the stored rate book; `*` stands for any row of a list. */
  path: string;
  label: string;
  /**
   * Beside the input. For money this is what the amount is per ("per sheet"); the currency is put in
   * front of it by `unitText`.
   */
  unit: string;
  help: string;
  /** May be left empty (the schema then uses its default, or the feature is off). */
  optional?: boolean;
  /** For `choice`: the stored values and the words shown for them. */
  options?: readonly { value: string; label: string }[];
  /** For `reference`: which lists its id may come from. */
  refersTo?: readonly ReferenceList[];
  /** For fields of one treatment row: the kinds of treatment that have this field. */
  kinds?: readonly TreatmentKind[];
  /** For a shiplap's material source: the source (`from`) that has this field. */
  source?: 'sheet' | 'boards';
};

export type ListDescriptor = {
  /** Dotted path of the list in the stored rate book (may sit inside another list's row: `*`). */
  path: string;
  label: string;
  /** What one row is called, for "Add …" and "Remove …" buttons. */
  itemLabel: string;
  help: string;
  /** Most rows the schema takes. */
  max: number;
};

export type SectionDescriptor = {
  id: string;
  group: GroupId;
  title: string;
  help?: string;
  /** Fields and lists of this section in screen order: patterns of `RATE_BOOK_FIELDS` and `RATE_BOOK_LISTS`. */
  entries: readonly string[];
};

export const RATE_BOOK_GROUPS: readonly { id: GroupId; title: string; help: string }[] = [
  { id: 'materials', title: 'Materials', help: 'What you buy and what you pay for it: sheets, boards, mouldings and supplies.' },
  { id: 'finishes', title: 'Finishes', help: 'Each finish you offer homeowners, the stock it is made from and how fast it goes up.' },
  { id: 'labour', title: 'Labour', help: 'Your hourly rate and the time each piece of work takes.' },
  { id: 'extras', title: 'Extras', help: 'Charges added to a job when they apply.' },
  { id: 'pricing', title: 'Pricing', help: 'How the total is worked out from materials and labour.' },
  { id: 'range', title: 'Range', help: 'How far below and above the worked-out price the range shown to a homeowner reaches.' },
  { id: 'triage', title: 'Triage weights', help: 'How much each reason counts towards an inquiry’s score in Inquiries (0–100).' },
];

// ---------------------------------------------------------------------------------------------
// Small builders, so each field below reads as one line of facts.

type Extra = Partial<Pick<FieldDescriptor, 'optional' | 'kinds' | 'source'>>;
const money = (path: string, label: string, unit: string, help: string, extra: Extra = {}): FieldDescriptor => ({
  kind: 'money',
  path,
  label,
  unit,
  help,
  ...extra,
});
const percent = (path: string, label: string, help: string, extra: Extra = {}): FieldDescriptor => ({
  kind: 'percent',
  path,
  label,
  unit: '%',
  help,
  ...extra,
});
const hours = (path: string, label: string, unit: string, help: string, extra: Extra = {}): FieldDescriptor => ({
  kind: 'hours',
  path,
  label,
  unit,
  help,
  ...extra,
});
const inches = (path: string, label: string, help: string, extra: Extra = {}): FieldDescriptor => ({ kind: 'inches', path, label, unit: 'in', help, ...extra });
const count = (path: string, label: string, unit: string, help: string, extra: Extra = {}): FieldDescriptor => ({
  kind: 'count',
  path,
  label,
  unit,
  help,
  ...extra,
});
const number = (path: string, label: string, unit: string, help: string, extra: Extra = {}): FieldDescriptor => ({
  kind: 'number',
  path,
  label,
  unit,
  help,
  ...extra,
});
const text = (path: string, label: string, help: string, extra: Extra = {}): FieldDescriptor => ({ kind: 'text', path, label, unit: '', help, ...extra });
const flag = (path: string, label: string, help: string, extra: Extra = {}): FieldDescriptor => ({ kind: 'flag', path, label, unit: '', help, ...extra });
const choice = (path: string, label: string, options: FieldDescriptor['options'], help: string, extra: Extra = {}): FieldDescriptor => ({
  kind: 'choice',
  path,
  label,
  unit: '',
  help,
  options,
  ...extra,
});
const reference = (path: string, label: string, refersTo: readonly ReferenceList[], help: string, extra: Extra = {}): FieldDescriptor => ({
  kind: 'reference',
  path,
  label,
  unit: '',
  help,
  refersTo,
  ...extra,
});

const ID_HELP = 'A short name that finishes and trim choices use to point at this row: lowercase letters, digits and dashes.';
const NOMINAL_OPTIONS = ['1x2', '1x3', '1x4', '1x6', '1x8', '1x10', '1x12'].map((value) => ({ value, label: value }));
const ALL_KINDS = ['shiplap', 'board-and-batten', 'beadboard', 'flat-panel', 'picture-frame'] as const satisfies readonly TreatmentKind[];

export const TREATMENT_KIND_OPTIONS: readonly { value: TreatmentKind; label: string }[] = [
  { value: 'shiplap', label: 'Shiplap' },
  { value: 'board-and-batten', label: 'Board and batten' },
  { value: 'beadboard', label: 'Beadboard' },
  { value: 'flat-panel', label: 'Flat-panel wainscot' },
  { value: 'picture-frame', label: 'Picture-frame moulding' },
];

/** A coating (primer or paint): the same five facts and its container sizes. */
function coating(key: 'primer' | 'paint', noun: string, coatsHelp: string): FieldDescriptor[] {
  const base = `catalogue.supplies.${key}`;
  return [
    text(`${base}.name`, `${noun} name`, 'As it appears on the material list.'),
    number(`${base}.sqFtPerGallon`, `${noun} coverage`, 'sq ft per gallon', 'From the can’s label for the surface you put it on.'),
    count(`${base}.coats`, `${noun} coats`, 'coats', coatsHelp),
    money(`${base}.priceCents`, `${noun} price per gallon`, 'per gallon', 'Used when no container sizes are listed below.'),
    text(`${base}.containers.*.name`, 'Container name', 'Such as quart, gallon or 5-gallon pail.'),
    number(`${base}.containers.*.gallons`, 'Container size', 'US gallons', 'A quart is 0.25.'),
    money(`${base}.containers.*.priceCents`, 'Container price', 'each', 'What one container costs you.'),
  ];
}

const fixtureNames = { tub: 'tub', shower: 'shower', vanity: 'vanity', toilet: 'toilet', radiator: 'radiator', 'built-in': 'built-in' } as const;

/** Range spreads: below and above, with and without photos, for each way the walls were measured. */
function spreads(): FieldDescriptor[] {
  const methods = [
    ['homeowner-estimate', 'Homeowner’s estimate'],
    ['homeowner-tape', 'Homeowner’s tape'],
    ['site-measure', 'Site measurement'],
  ] as const;
  return methods.flatMap(([method, name]) =>
    (['withPhotos', 'withoutPhotos'] as const).flatMap((photos) => {
      const words = photos === 'withPhotos' ? 'with photos' : 'without photos';
      return [
        percent(`range.${method}.${photos}.below`, `${name} ${words}: below`, `How far under the worked-out price the range starts.`),
        percent(`range.${method}.${photos}.above`, `${name} ${words}: above`, `How far over the worked-out price the range ends.`),
      ];
    }),
  );
}

/** Every field of the Rate book, in the order the editor shows them. */
export const RATE_BOOK_FIELDS: readonly FieldDescriptor[] = [
  // Materials: sheets
  text('catalogue.sheets.*.id', 'Sheet id', ID_HELP),
  text('catalogue.sheets.*.name', 'Sheet name', 'As it appears on the material list.'),
  inches('catalogue.sheets.*.width', 'Sheet width', 'The short side; 48 in for a 4 × 8 ft sheet.'),
  inches('catalogue.sheets.*.height', 'Sheet length', 'The long side; 96 in for a 4 × 8 ft sheet.'),
  inches('catalogue.sheets.*.thickness', 'Sheet thickness', 'Decides where the new face stands against casings and baseboard.'),
  money('catalogue.sheets.*.priceCents', 'Sheet price', 'per sheet', 'What one sheet costs you, before markup.'),
  flag('catalogue.sheets.*.moistureResistant', 'Moisture resistant', 'Suitable for bathrooms and other damp rooms.'),
  // Materials: boards
  text('catalogue.boards.*.id', 'Board id', ID_HELP),
  text('catalogue.boards.*.name', 'Board name', 'As it appears on the material list.'),
  choice('catalogue.boards.*.nominal', 'Nominal size', NOMINAL_OPTIONS, 'Its dressed width and thickness follow; or leave it empty and give both below.', {
    optional: true,
  }),
  inches('catalogue.boards.*.width', 'Board width', 'Actual width; leave empty to use the nominal size’s.', { optional: true }),
  inches('catalogue.boards.*.thickness', 'Board thickness', 'Actual thickness; leave empty to use the nominal size’s.', { optional: true }),
  inches('catalogue.boards.*.faceWidth', 'Board face width', 'What shows once milled boards overlap; leave empty for the full width.', { optional: true }),
  inches('catalogue.boards.*.length', 'Stock length', 'The length you buy it in; 96 in is 8 ft.'),
  money('catalogue.boards.*.priceCents', 'Board price', 'per board', 'What one board of this length costs you.'),
  flag('catalogue.boards.*.moistureResistant', 'Moisture resistant', 'Suitable for bathrooms and other damp rooms.'),
  // Materials: mouldings
  text('catalogue.mouldings.*.id', 'Moulding id', ID_HELP),
  text('catalogue.mouldings.*.name', 'Moulding name', 'As it appears on the material list.'),
  inches('catalogue.mouldings.*.width', 'Moulding width', 'Its face height as it sits on the wall.'),
  inches('catalogue.mouldings.*.thickness', 'Moulding thickness', 'How far it stands off the wall.'),
  inches('catalogue.mouldings.*.length', 'Stock length', 'The length you usually buy; 96 in is 8 ft.'),
  money('catalogue.mouldings.*.priceCents', 'Moulding price', 'per length', 'What one stock length costs you.'),
  inches('catalogue.mouldings.*.longerLengths.*.length', 'Longer stock length', 'A longer length of the same profile, for runs the usual length cannot span.'),
  money('catalogue.mouldings.*.longerLengths.*.priceCents', 'Longer stock price', 'per length', 'What one piece of this longer length costs you.'),
  // Materials: trim choices
  reference('catalogue.baseboardId', 'Baseboard', ['mouldings'], 'The moulding used when a homeowner asks for new baseboard.'),
  reference('catalogue.capRailId', 'Cap rail', ['mouldings'], 'The moulding along the top of every wainscot.'),
  reference(
    'catalogue.skirtBoardId',
    'Skirt board',
    ['boards', 'mouldings'],
    'Run along the rake on a stair wall; the baseboard stands in when none is chosen.',
    {
      optional: true,
    },
  ),
  reference('catalogue.backBandId', 'Back band', ['mouldings'], 'Run around a casing where the new work would stand proud of it; none when not chosen.', {
    optional: true,
  }),
  reference('catalogue.insideCornerTrimId', 'Inside corner trim', ['mouldings'], 'Set in each inside corner; none when not chosen.', { optional: true }),
  reference('catalogue.outsideCornerTrimId', 'Outside corner trim', ['mouldings'], 'Set on each outside corner; none when not chosen.', { optional: true }),
  // Materials: casing and build-up
  inches('catalogue.casing.width', 'Casing width', 'The usual casing around doors and windows; the work stops at its edge.'),
  inches('catalogue.casing.thickness', 'Casing thickness', 'The new face must stay behind it, or a back band is added.'),
  inches(
    'catalogue.existingBaseboardThickness',
    'Existing baseboard thickness',
    'Where the new work stands proud of it, the baseboard is taken off and reset.',
    {
      optional: true,
    },
  ),
  inches('catalogue.stoolProjection', 'Window stool projection', 'How far window stools stand out from the wall; past it, stool and apron are refitted.', {
    optional: true,
  }),
  // Materials: cutting and waste
  percent('catalogue.wasteFactor', 'Waste factor', 'Added to field material for offcuts, defects and mistakes.'),
  percent('catalogue.defectAllowance', 'Defect allowance', 'Added for defects to quantities from an exact cutting plan, which get no waste factor.', {
    optional: true,
  }),
  inches('catalogue.kerf', 'Saw kerf', 'Lost at each cut.'),
  inches('catalogue.trimEndAllowance', 'Trim end allowance', 'Added to each end of a cap rail or baseboard cut for miters and fitting.'),
  inches('catalogue.studSpacing', 'Stud spacing', 'On centre; joints in horizontal boards and rails land on studs. 16 in when empty.', { optional: true }),
  // Materials: supplies
  text('catalogue.supplies.brads.name', 'Brad name', 'The brad used for everything when no sizes are listed below.'),
  count('catalogue.supplies.brads.perBox', 'Brads per box', 'brads', 'How many come in one box.'),
  number('catalogue.supplies.brads.perSqFt', 'Brads per sq ft of panelling', 'per sq ft', 'Your usual nailing of boards and sheets.'),
  number('catalogue.supplies.brads.perFootOfTrim', 'Brads per foot of trim', 'per ft', 'Your usual nailing of rails, battens and mouldings.'),
  money('catalogue.supplies.brads.priceCents', 'Brad box price', 'per box', 'What one box costs you.'),
  text('catalogue.supplies.brads.sizes.*.name', 'Brad size name', 'As it appears on the material list.'),
  inches('catalogue.supplies.brads.sizes.*.length', 'Brad length', 'Each fixing takes the shortest brad long enough for it.'),
  count('catalogue.supplies.brads.sizes.*.perBox', 'Brads per box', 'brads', 'How many come in one box.'),
  money('catalogue.supplies.brads.sizes.*.priceCents', 'Brad box price', 'per box', 'What one box costs you.'),
  text('catalogue.supplies.adhesive.name', 'Adhesive name', 'As it appears on the material list.'),
  number('catalogue.supplies.adhesive.fluidOunces', 'Adhesive tube size', 'fl oz', 'From the tube’s label.'),
  inches('catalogue.supplies.adhesive.bead', 'Adhesive bead size', 'Diameter of the bead you run.'),
  money('catalogue.supplies.adhesive.priceCents', 'Adhesive price', 'per tube', 'What one tube costs you.'),
  number(
    'catalogue.supplies.adhesive.feetPerSqFt',
    'Adhesive bead per sq ft',
    'ft per sq ft',
    'How much bead goes behind each square foot of boards or sheets.',
  ),
  text('catalogue.supplies.caulk.name', 'Caulk name', 'As it appears on the material list.'),
  number('catalogue.supplies.caulk.fluidOunces', 'Caulk tube size', 'fl oz', 'From the tube’s label.'),
  inches('catalogue.supplies.caulk.bead', 'Caulk bead size', 'The leg of the triangular bead in a joint.'),
  money('catalogue.supplies.caulk.priceCents', 'Caulk price', 'per tube', 'What one tube costs you.'),
  text('catalogue.supplies.filler.name', 'Filler name', 'As it appears on the material list.'),
  number('catalogue.supplies.filler.sqFtPerUnit', 'Filler coverage', 'sq ft per tub', 'How much finished face one tub fills.'),
  money('catalogue.supplies.filler.priceCents', 'Filler price', 'per tub', 'What one tub costs you.'),
  ...coating('primer', 'Primer', 'Coats of primer on raw wood or MDF.'),
  ...coating('paint', 'Paint', 'Finish coats; each coat is a site visit of its own.'),
  text('catalogue.supplies.boxExtender.name', 'Box extender name', 'As it appears on the material list.'),
  money(
    'catalogue.supplies.boxExtender.priceCents',
    'Box extender price',
    'each',
    'One per outlet or switch where the wall gets thicker. The power goes off at the breaker first; local electrical codes apply.',
  ),
  // Finishes
  choice('catalogue.treatments.*.kind', 'Kind of finish', TREATMENT_KIND_OPTIONS, 'Decides which stock and spacing the finish needs.'),
  text('catalogue.treatments.*.id', 'Finish id', 'A short name the widget and stored inquiries use for this finish: lowercase letters, digits and dashes.'),
  text('catalogue.treatments.*.name', 'Finish name', 'What homeowners see in the price widget.'),
  flag('catalogue.treatments.*.enabled', 'Offered', 'Homeowners may choose it. A damp-room alternative may stay off here.'),
  reference('catalogue.treatments.*.source.sheetId', 'Sheet', ['sheets'], 'The sheet ripped into strips.', { kinds: ['shiplap'], source: 'sheet' }),
  inches('catalogue.treatments.*.source.stripWidth', 'Strip width', 'Width of each strip ripped from the sheet.', { kinds: ['shiplap'], source: 'sheet' }),
  reference('catalogue.treatments.*.source.boardId', 'Board', ['boards'], 'The board laid up the wall.', { kinds: ['shiplap'], source: 'boards' }),
  choice(
    'catalogue.treatments.*.source.from',
    'Made from',
    [
      { value: 'sheet', label: 'Strips ripped from sheets' },
      { value: 'boards', label: 'Boards' },
    ],
    'Where the shiplap’s pieces come from.',
    { kinds: ['shiplap'] },
  ),
  choice(
    'catalogue.treatments.*.orientation',
    'Board direction',
    [
      { value: 'vertical', label: 'Vertical' },
      { value: 'horizontal', label: 'Horizontal' },
    ],
    'How the boards run on the wall.',
    { kinds: ['shiplap'] },
  ),
  inches('catalogue.treatments.*.gap', 'Gap between boards', 'The reveal left between neighbouring boards.', { kinds: ['shiplap'] }),
  reference('catalogue.treatments.*.battenId', 'Batten', ['boards'], 'The board used for battens.', { kinds: ['board-and-batten'] }),
  inches('catalogue.treatments.*.battenSpacing', 'Batten spacing', 'Greatest centre-to-centre spacing; battens are spread evenly and sit at both ends.', {
    kinds: ['board-and-batten'],
  }),
  reference('catalogue.treatments.*.topRailId', 'Top rail', ['boards'], 'A board along the top of the battens; none when not chosen.', {
    kinds: ['board-and-batten'],
    optional: true,
  }),
  reference('catalogue.treatments.*.sheetId', 'Beadboard panel', ['sheets'], 'The panel put on the wall.', { kinds: ['beadboard'] }),
  reference('catalogue.treatments.*.stileId', 'Stile', ['boards'], 'The board used for the upright stiles.', { kinds: ['flat-panel'] }),
  reference('catalogue.treatments.*.railId', 'Rail', ['boards'], 'The board used for the top and bottom rails.', { kinds: ['flat-panel'] }),
  inches('catalogue.treatments.*.stileSpacing', 'Stile spacing', 'Greatest centre-to-centre spacing of stiles.', { kinds: ['flat-panel'] }),
  reference(
    'catalogue.treatments.*.backingSheetId',
    'Backing sheet',
    ['sheets'],
    'A sheet behind the battens or panels; without one they go on the painted wall.',
    {
      kinds: ['board-and-batten', 'flat-panel'],
      optional: true,
    },
  ),
  reference('catalogue.treatments.*.mouldingId', 'Frame moulding', ['mouldings'], 'The moulding the frames are made of.', { kinds: ['picture-frame'] }),
  inches('catalogue.treatments.*.margin', 'Frame margin', 'Space between a frame and the baseboard, cap rail, wall end or an opening.', {
    kinds: ['picture-frame'],
  }),
  inches('catalogue.treatments.*.frameGap', 'Space between frames', 'Between neighbouring frames.', { kinds: ['picture-frame'] }),
  inches('catalogue.treatments.*.targetFrameWidth', 'Target frame width', 'Frames are sized near this to fill each stretch of wall evenly.', {
    kinds: ['picture-frame'],
  }),
  count('catalogue.treatments.*.fullHeightRows', 'Rows of frames', 'rows', 'On a full-height wall; a wainscot always has one row. 2 when empty.', {
    kinds: ['picture-frame'],
    optional: true,
  }),
  choice(
    'catalogue.treatments.*.layout',
    'Layout balance',
    [
      { value: 'from-left', label: 'From the left end (last piece ripped)' },
      { value: 'balanced', label: 'Balanced (both end pieces ripped alike)' },
    ],
    'How pieces are set out across the wall.',
    { optional: true },
  ),
  inches('catalogue.treatments.*.minEndWidth', 'Narrowest end board', 'The narrowest end piece you accept in a balanced layout. 1.5 in when empty.', {
    optional: true,
  }),
  number('catalogue.treatments.*.sqFtPerHour', 'Productivity', 'sq ft per hour', 'How much of this finish one installer puts up in an hour.'),
  flag('catalogue.treatments.*.needsPrimer', 'Needs primer', 'Raw wood or MDF gets a coat of primer before paint.', { optional: true }),
  number(
    'catalogue.treatments.*.paintFactor',
    'Painting factor',
    '× flat face',
    'Grooves and gaps paint slower: painting time is multiplied by this. 1 is a flat face.',
    {
      optional: true,
    },
  ),
  reference(
    'catalogue.treatments.*.dampRoomTreatmentId',
    'Damp-room alternative',
    ['treatments'],
    'A finish of the same kind in moisture-resistant stock, used in bathrooms and other damp rooms instead.',
    {
      optional: true,
    },
  ),
  // Labour
  money('labour.rateCents', 'Labour rate', 'per hour', 'What an hour of installer time is charged at.'),
  hours('labour.hoursPerCutOut', 'Time per cut-out', 'hours', 'For each outlet or switch cut around.'),
  hours('labour.hoursPerReturn', 'Time per window or door return', 'hours', 'Wrapping the work into an opening’s return.'),
  hours('labour.hoursPerCorner', 'Time per corner', 'hours', 'Fitting the work at an inside or outside corner.'),
  hours('labour.hoursPerFootBaseboardRemoved', 'Time per foot of baseboard removed', 'hours per ft', 'Taking off the old baseboard.'),
  hours('labour.hoursPerFootBaseboardInstalled', 'Time per foot of baseboard installed', 'hours per ft', 'Fitting new or reset baseboard.'),
  hours('labour.hoursPerFootCapRail', 'Time per foot of cap rail', 'hours per ft', 'Fitting the cap rail on a wainscot.'),
  hours('labour.hoursPerFootBackBand', 'Time per foot of back band', 'hours per ft', 'Fitting back band around casings.', { optional: true }),
  hours('labour.hoursPerRakeCut', 'Time per rake cut', 'hours', 'Marking and cutting one end to a stair’s angle.', { optional: true }),
  hours('labour.hoursPerStoolRefit', 'Time per window stool refit', 'hours', 'Taking off and refitting one window’s stool and apron.', { optional: true }),
  number('labour.paintSqFtPerHour', 'Painting productivity', 'sq ft per hour per coat', 'On a flat face; each finish’s painting factor slows it.'),
  hours('labour.setupHoursPerVisit', 'Set-up and clean-up per visit', 'hours', 'On each site visit: install days, caulk and fill, each coat.', {
    optional: true,
  }),
  hours('labour.setupHoursPerRoom', 'Set-up and clean-up per room (older rate books)', 'hours', 'Used only when the per-visit figure above is empty.', {
    optional: true,
  }),
  hours('labour.hoursPerDay', 'Working hours per day', 'hours', 'For counting install visits. 8 when empty.', { optional: true }),
  ...Object.entries(fixtureNames).map(([key, name]) =>
    hours(
      `labour.hoursPerFixture.${key}`,
      `Time per ${name}`,
      'hours',
      key === 'toilet' || key === 'radiator'
        ? `Removing and resetting a ${name}; plumbing and heating connections are for a licensed trade where local codes say so.`
        : `Scribing the work to a ${name}.`,
      { optional: true },
    ),
  ),
  // Extras
  money(
    'extras.leadSafe.perJobCents',
    'Lead-safe set-up per job',
    'per job',
    'Containment and clean-up for homes built before 1978. Follow your local lead-safe rules and certification.',
  ),
  money('extras.leadSafe.perRoomCents', 'Lead-safe set-up per room', 'per room', 'Added for each room worked in under lead-safe practices.'),
  flag(
    'extras.leadSafe.everyPre1978Job',
    'Charge lead-safe set-up on every pre-1978 job',
    'Otherwise only when painted surfaces are disturbed beyond minor repair.',
  ),
  inches('extras.highCeiling.aboveHeight', 'High-ceiling threshold', 'Rooms with a higher ceiling get the charge below (taller ladders or scaffolding).'),
  money('extras.highCeiling.perRoomCents', 'High-ceiling charge per room', 'per room', 'For the extra access equipment and care.'),
  text('extras.tripZones.*.id', 'Trip zone id', 'A short name the widget sends: lowercase letters, digits and dashes.'),
  text('extras.tripZones.*.name', 'Trip zone name', 'What homeowners pick, such as “Within 15 miles”.'),
  money('extras.tripZones.*.feeCents', 'Trip fee', 'per job', 'Added once to a job in this zone.'),
  // Pricing
  percent('materialMarkup', 'Material markup', 'Added to what materials cost you.'),
  percent('taxRate', 'Tax rate', 'Sales tax charged on the part chosen below.'),
  choice(
    'taxOn',
    'Tax applies to',
    [
      { value: 'materials', label: 'Materials only' },
      { value: 'everything', label: 'The whole price' },
    ],
    'Follow your local tax rules.',
  ),
  money('minimumJobCents', 'Minimum job', 'per job', 'No range starts below this.'),
  money('roundingCents', 'Rounding step', '', 'The low end is rounded down and the high end up to a multiple of this.'),
  text('currency', 'Currency', 'Three-letter code such as USD; every price above is in it.'),
  text('locale', 'Number format', 'How prices are written, as a language tag such as en-US.', { optional: true }),
  choice(
    'units',
    'Units shown to homeowners',
    [
      { value: 'imperial', label: 'Feet and inches' },
      { value: 'metric', label: 'Metric' },
    ],
    'The widget and e-mails show lengths in these; the Rate book keeps inches.',
  ),
  // Range
  ...spreads(),
  // Triage weights
  number('triage.serviceArea', 'Points for being inside the service area', 'points', 'Earned by an inquiry inside your service area.', { optional: true }),
  number('triage.jobSize', 'Points for the size of the job', 'points', 'Earned in full by a job of the size below; smaller jobs earn their share.', {
    optional: true,
  }),
  number('triage.fullSizeSqFt', 'Covered area that earns all the size points', 'sq ft', 'Jobs this size or larger earn all the size points.', {
    optional: true,
  }),
  number('triage.photos', 'Points for photos', 'points', 'Earned in full by the number of photos below.', { optional: true }),
  count('triage.fullPhotos', 'Photos that earn all the photo points', 'photos', 'Fewer photos earn their share.', { optional: true }),
  number('triage.measurement', 'Points for how the walls were measured', 'points', 'A tape earns more than a guess; a site measurement most.', {
    optional: true,
  }),
  number('triage.response', 'Points for answering within the response target', 'points', 'Lost once the response target passes without a first contact.', {
    optional: true,
  }),
];

/** Every list of the Rate book (rows added and removed on screen). */
export const RATE_BOOK_LISTS: readonly ListDescriptor[] = [
  { path: 'catalogue.sheets', label: 'Sheets', itemLabel: 'sheet', help: 'Plywood, MDF and panels, by the sheet.', max: 50 },
  { path: 'catalogue.boards', label: 'Boards', itemLabel: 'board', help: 'Boards, battens and rails, by stock length.', max: 50 },
  {
    path: 'catalogue.mouldings',
    label: 'Mouldings',
    itemLabel: 'moulding',
    help: 'Baseboard, cap rail, frame and corner mouldings, by stock length.',
    max: 50,
  },
  {
    path: 'catalogue.mouldings.*.longerLengths',
    label: 'Longer lengths',
    itemLabel: 'longer length',
    help: 'The same profile in longer lengths, each at its own price.',
    max: 5,
  },
  {
    path: 'catalogue.supplies.brads.sizes',
    label: 'Brad sizes',
    itemLabel: 'brad size',
    help: 'Brad lengths you stock; without any, the brad above is used for everything.',
    max: 10,
  },
  {
    path: 'catalogue.supplies.primer.containers',
    label: 'Primer containers',
    itemLabel: 'primer container',
    help: 'Sizes you buy; the cheapest mix that covers is bought.',
    max: 6,
  },
  {
    path: 'catalogue.supplies.paint.containers',
    label: 'Paint containers',
    itemLabel: 'paint container',
    help: 'Sizes you buy; the cheapest mix that covers is bought.',
    max: 6,
  },
  { path: 'catalogue.treatments', label: 'Finishes', itemLabel: 'finish', help: 'Each finish homeowners may choose, and its damp-room alternatives.', max: 50 },
  { path: 'extras.tripZones', label: 'Trip zones', itemLabel: 'trip zone', help: 'Distance bands a homeowner picks from, each with its fee.', max: 20 },
];

const inSection = (prefix: string) =>
  RATE_BOOK_FIELDS.filter((f) => f.path.startsWith(prefix) && !f.path.slice(prefix.length).includes('*')).map((f) => f.path);

/** The editor's sections in screen order, each in one group. */
export const RATE_BOOK_SECTIONS: readonly SectionDescriptor[] = [
  { id: 'sheets', group: 'materials', title: 'Sheets', entries: ['catalogue.sheets'] },
  { id: 'boards', group: 'materials', title: 'Boards', entries: ['catalogue.boards'] },
  { id: 'mouldings', group: 'materials', title: 'Mouldings', entries: ['catalogue.mouldings'] },
  {
    id: 'trim',
    group: 'materials',
    title: 'Trim choices',
    entries: [
      'catalogue.baseboardId',
      'catalogue.capRailId',
      'catalogue.skirtBoardId',
      'catalogue.backBandId',
      'catalogue.insideCornerTrimId',
      'catalogue.outsideCornerTrimId',
    ],
  },
  {
    id: 'build-up',
    group: 'materials',
    title: 'Casing and build-up',
    help: 'What is already on the walls, which the new work must fit against.',
    entries: ['catalogue.casing.width', 'catalogue.casing.thickness', 'catalogue.existingBaseboardThickness', 'catalogue.stoolProjection'],
  },
  {
    id: 'cutting',
    group: 'materials',
    title: 'Cutting and waste',
    entries: ['catalogue.wasteFactor', 'catalogue.defectAllowance', 'catalogue.kerf', 'catalogue.trimEndAllowance', 'catalogue.studSpacing'],
  },
  { id: 'brads', group: 'materials', title: 'Brads', entries: [...inSection('catalogue.supplies.brads.'), 'catalogue.supplies.brads.sizes'] },
  { id: 'adhesive', group: 'materials', title: 'Adhesive', entries: inSection('catalogue.supplies.adhesive.') },
  { id: 'caulk', group: 'materials', title: 'Caulk', entries: inSection('catalogue.supplies.caulk.') },
  { id: 'filler', group: 'materials', title: 'Filler', entries: inSection('catalogue.supplies.filler.') },
  { id: 'primer', group: 'materials', title: 'Primer', entries: [...inSection('catalogue.supplies.primer.'), 'catalogue.supplies.primer.containers'] },
  { id: 'paint', group: 'materials', title: 'Paint', entries: [...inSection('catalogue.supplies.paint.'), 'catalogue.supplies.paint.containers'] },
  { id: 'box-extender', group: 'materials', title: 'Box extenders', entries: inSection('catalogue.supplies.boxExtender.') },
  { id: 'treatments', group: 'finishes', title: 'Finishes', entries: ['catalogue.treatments'] },
  { id: 'labour-rate', group: 'labour', title: 'Rate and productivity', entries: ['labour.rateCents', 'labour.paintSqFtPerHour', 'labour.hoursPerDay'] },
  {
    id: 'labour-items',
    group: 'labour',
    title: 'Time per item',
    entries: [
      'labour.hoursPerCutOut',
      'labour.hoursPerReturn',
      'labour.hoursPerCorner',
      'labour.hoursPerFootBaseboardRemoved',
      'labour.hoursPerFootBaseboardInstalled',
      'labour.hoursPerFootCapRail',
      'labour.hoursPerFootBackBand',
      'labour.hoursPerRakeCut',
      'labour.hoursPerStoolRefit',
    ],
  },
  { id: 'labour-setup', group: 'labour', title: 'Set-up', entries: ['labour.setupHoursPerVisit', 'labour.setupHoursPerRoom'] },
  {
    id: 'labour-fixtures',
    group: 'labour',
    title: 'Fixtures',
    help: 'Empty means no extra time for that fixture.',
    entries: inSection('labour.hoursPerFixture.'),
  },
  { id: 'lead-safe', group: 'extras', title: 'Lead-safe work', entries: inSection('extras.leadSafe.') },
  { id: 'high-ceiling', group: 'extras', title: 'High ceilings', entries: inSection('extras.highCeiling.') },
  { id: 'trip-zones', group: 'extras', title: 'Trip zones', entries: ['extras.tripZones'] },
  { id: 'price', group: 'pricing', title: 'Markup, tax and minimum', entries: ['materialMarkup', 'taxRate', 'taxOn', 'minimumJobCents', 'roundingCents'] },
  { id: 'writing', group: 'pricing', title: 'Currency and units', entries: ['currency', 'locale', 'units'] },
  ...(['homeowner-estimate', 'homeowner-tape', 'site-measure'] as const).map((method) => ({
    id: `range-${method}`,
    group: 'range' as const,
    title: { 'homeowner-estimate': 'Homeowner’s estimate', 'homeowner-tape': 'Homeowner’s tape', 'site-measure': 'Site measurement' }[method],
    entries: inSection(`range.${method}.`),
  })),
  { id: 'triage', group: 'triage', title: 'Triage weights', entries: inSection('triage.') },
];

// ---------------------------------------------------------------------------------------------
// Looking fields up by the concrete path a form or an error names.

const byPattern = new Map(RATE_BOOK_FIELDS.map((f) => [f.path, f]));
const listByPattern = new Map(RATE_BOOK_LISTS.map((l) => [l.path, l]));

/** `catalogue.sheets.3.priceCents` → `catalogue.sheets.*.priceCents`. */
export function patternOf(path: string | readonly PropertyKey[]): string {
  const parts = typeof path === 'string' ? path.split('.') : path.map(String);
  return parts.map((p) => (/^\d+$/.test(p) ? '*' : p)).join('.');
}

/** The descriptor of the field at a concrete path, if the path names a field. */
export function fieldAt(path: string | readonly PropertyKey[]): FieldDescriptor | undefined {
  return byPattern.get(patternOf(path));
}

/** The descriptor of the list at a concrete path, if the path names a list. */
export function listAt(path: string | readonly PropertyKey[]): ListDescriptor | undefined {
  return listByPattern.get(patternOf(path));
}

/** Fields directly in each row of a list (not those of lists nested in the row). */
export function rowFields(listPattern: string): FieldDescriptor[] {
  const prefix = `${listPattern}.*.`;
  return RATE_BOOK_FIELDS.filter((f) => f.path.startsWith(prefix) && !f.path.slice(prefix.length).includes('*'));
}

/** Lists nested in each row of a list. */
export function rowLists(listPattern: string): ListDescriptor[] {
  const prefix = `${listPattern}.*.`;
  return RATE_BOOK_LISTS.filter((l) => l.path.startsWith(prefix) && !l.path.slice(prefix.length).includes('*'));
}

/** Whether a treatment row's field applies to a treatment of this kind (and, for shiplap, this source). */
export function appliesToTreatment(field: FieldDescriptor, kind: string | undefined, from: string | undefined): boolean {
  if (field.kinds && !field.kinds.includes(kind as TreatmentKind)) return false;
  if (field.source && field.source !== from) return false;
  return true;
}

/** "USD per sheet", "%", "in": the words beside a field's input. */
export function unitText(field: FieldDescriptor, currency: string): string {
  if (field.kind === 'money') return [currency, field.unit].filter(Boolean).join(' ');
  return field.unit;
}

export const TREATMENT_KINDS: readonly TreatmentKind[] = ALL_KINDS;
