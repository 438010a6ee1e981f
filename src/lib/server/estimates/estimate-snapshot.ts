/**
 * The estimate as stored on a lead: the core's `Estimate`, in a versioned envelope, read back
 * through a zod schema that mirrors `src/lib/estimate/types.ts`. When the core's output gains a
 * field, bump SNAPSHOT_VERSION and add an upgrade step that gives older snapshots a value for it;
 * the type check at the bottom fails until the schema and the core agree.
 */
import { z } from 'zod';
import type { Estimate } from '~/lib/estimate';
import { versionedJson } from '../db/versioned-json';

const num = z.number();
const str = z.string();

const placedOpening = z.object({
  kind: z.enum(['door', 'window']),
  offset: num,
  width: num,
  height: num,
  sillHeight: num,
  inBand: z.boolean(),
  assumed: z.boolean(),
  casingWidth: num.optional(),
});

const placedFixture = z.object({
  kind: z.enum(['tub', 'shower', 'vanity', 'toilet', 'radiator', 'built-in']),
  offset: num,
  width: num,
  height: num,
  placement: z.enum(['stops', 'behind']),
  assumed: z.boolean(),
});

const placedBox = z.object({
  kind: z.enum(['outlet', 'switch']),
  offset: num,
  bottom: num,
  width: num,
  height: num,
  covered: z.boolean(),
  capRailCrosses: z.boolean(),
});

const wallPiece = z.object({
  role: z.enum(['board', 'strip', 'panel', 'batten', 'stile', 'rail', 'frame', 'cap-rail', 'baseboard']),
  x: num,
  y: num,
  width: num,
  height: num,
  ripped: z.boolean().optional(),
});

const boardLayout = z.object({
  orientation: z.enum(['vertical', 'horizontal']),
  boardWidth: num,
  gap: num,
  count: num,
  lastWidth: num,
  leftover: num,
  firstWidth: num.optional(),
});

const wallTakeoff = z.object({
  label: str,
  length: num,
  ceilingHeight: num,
  bandBottom: num,
  bandTop: num,
  coveredHeight: num,
  grossSqFt: num,
  openingsSqFt: num,
  netSqFt: num,
  openings: z.array(placedOpening),
  fixtures: z.array(placedFixture).optional(),
  fixturesSqFt: num.optional(),
  boxes: z.array(placedBox),
  cutOuts: num,
  returns: num,
  boards: boardLayout.optional(),
  frames: z.object({ count: num, width: num, height: num }).optional(),
  rake: z.tuple([z.object({ x: num, y: num }), z.object({ x: num, y: num })]).optional(),
  rakeCuts: num.optional(),
  skirtFeet: num.optional(),
  pieces: z.array(wallPiece),
  capRailFeet: num,
  baseboardFeet: num,
  notes: z.array(str),
});

const roomTakeoff = z.object({
  name: str,
  treatmentId: str,
  treatmentName: str,
  treatmentKind: z.enum(['shiplap', 'board-and-batten', 'beadboard', 'flat-panel', 'picture-frame']),
  dampAlternativeFor: str.optional(),
  height: z.enum(['wainscot', 'full']),
  ceilingHeight: num,
  bandTop: num,
  walls: z.array(wallTakeoff),
  grossSqFt: num,
  netSqFt: num,
  paintSqFt: num,
  cutOuts: num,
  returns: num,
  insideCorners: num,
  outsideCorners: num,
  capRailFeet: num,
  baseboardFeet: num,
  baseboardRemovedFeet: num,
  baseboardReset: z.boolean().optional(),
  backBandFeet: num.optional(),
  skirtFeet: num.optional(),
  rakeCuts: num.optional(),
  stoolRefits: num.optional(),
  disturbedPaintSqFt: num,
  panelSqFt: num,
  trimFeet: num,
  caulkFeet: num,
  damp: z.boolean(),
});

const materialLine = z.object({
  id: str,
  label: str,
  quantity: num,
  unit: z.enum(['sheet', 'piece', 'box', 'tube', 'gallon', 'each', 'set']),
  needed: num,
  unitCents: num,
  basis: str,
  piecesPerSheet: num.optional(),
  cuts: num.optional(),
  stockLength: num.optional(),
  packs: z.array(z.object({ name: str, gallons: num, priceCents: num, count: num })).optional(),
});

const caution = z.object({
  id: z.enum(['electrical-boxes', 'cap-rail-box', 'lead-safe', 'damp-room', 'wet-zone', 'ladder', 'tools', 'fixture-trades', 'stair']),
  title: str,
  text: str,
  rooms: z.array(str),
});

const takeoff = z.object({
  units: z.enum(['imperial', 'metric']),
  rooms: z.array(roomTakeoff),
  grossSqFt: num,
  netSqFt: num,
  paintSqFt: num,
  cutOuts: num,
  materials: z.array(materialLine),
  cautions: z.array(caution),
  facts: z.object({
    paint: z.boolean(),
    builtBefore1978: z.enum(['yes', 'no', 'not-sure']),
    measuredBy: z.enum(['homeowner-estimate', 'homeowner-tape', 'site-measure']),
    photoCount: num,
    tripZone: str.optional(),
  }),
  notes: z.array(str),
});

const labourLine = z.object({
  task: z.enum([
    'install',
    'cut-outs',
    'returns',
    'corners',
    'baseboard-removal',
    'baseboard',
    'cap-rail',
    'back-band',
    'skirt-board',
    'rake-cuts',
    'stool-refit',
    'paint',
    'setup',
    'fixture-reset',
    'fixture-scribe',
  ]),
  label: str,
  hours: num,
  basis: str,
});

const priceLine = z.object({
  group: z.enum(['materials', 'markup', 'labour', 'extras', 'tax', 'minimum']),
  label: str,
  quantity: num,
  unit: str,
  unitCents: num,
  totalCents: num,
  basis: str,
});

const price = z.object({
  currency: str,
  locale: str,
  labour: z.array(labourLine),
  labourHours: num,
  visits: z.object({ total: num, installDays: num, caulkAndFill: num, primerCoats: num, paintCoats: num, setupHoursEach: num }).optional(),
  lines: z.array(priceLine),
  materialsCents: num,
  markupCents: num,
  labourCents: num,
  extrasCents: num,
  taxCents: num,
  subtotalCents: num,
  totalCents: num,
  minimumApplied: z.boolean(),
  lowCents: num,
  highCents: num,
  spread: z.object({ below: num, above: num, basis: str }),
  roundingCents: num.optional(),
  rangeText: str,
});

export const estimateSchema = z.object({ takeoff, price });

export const SNAPSHOT_VERSION = 1;

export const estimateSnapshot = versionedJson<Estimate>({
  name: 'lead estimate',
  version: SNAPSHOT_VERSION,
  schema: estimateSchema,
  // Version 0: snapshots stored before envelopes, already in the version-1 shape.
  upgrades: { 0: (data) => data },
});

// Compile-time agreement between this schema and the core's type, in both directions.
type Parsed = z.output<typeof estimateSchema>;
const sameShape: [Parsed extends Estimate ? true : false, Estimate extends Parsed ? true : false] = [true, true];
void sameShape;
