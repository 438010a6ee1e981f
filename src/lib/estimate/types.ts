/**
 * The estimate's output: plain JSON-serialisable data, stored as a snapshot on each lead.
 * Lengths in inches, areas in square feet, money in integer cents.
 */
import type { Units } from './units.ts';
import type { MeasuredBy, TreatmentKind } from './schemas.ts';

export interface PlacedOpening {
  kind: 'door' | 'window';
  /** From the wall's left end to the opening's left edge. */
  offset: number;
  width: number;
  height: number;
  sillHeight: number;
  /** Whether the opening reaches into the covered band (and so needs a return). */
  inBand: boolean;
  /** True when size or place were filled in with defaults rather than measured. */
  assumed: boolean;
  /** Width of the casing around it (sides and head); the treatment stops at its outside edge. */
  casingWidth?: number;
}

export interface PlacedFixture {
  kind: 'tub' | 'shower' | 'vanity' | 'toilet' | 'radiator' | 'built-in';
  /** From the wall's left end to the fixture's left edge. */
  offset: number;
  width: number;
  height: number;
  /** 'stops': the treatment stops at it; 'behind': it comes off and is set back over the treatment. */
  placement: 'stops' | 'behind';
  /** True when size or place were filled in with defaults rather than measured. */
  assumed: boolean;
}

export interface PlacedBox {
  kind: 'outlet' | 'switch';
  offset: number;
  bottom: number;
  width: number;
  height: number;
  /** Inside the new wall finish: needs a cut-out and a box extender. */
  covered: boolean;
  /** The cap rail would run through this box. */
  capRailCrosses: boolean;
}

/** One rectangle of material on the wall, for drawings and cut lists (x from the left end, y from the floor). */
export interface WallPiece {
  role: 'board' | 'strip' | 'panel' | 'batten' | 'stile' | 'rail' | 'frame' | 'cap-rail' | 'baseboard';
  x: number;
  y: number;
  width: number;
  height: number;
  /** Ripped narrower than the stock width. */
  ripped?: boolean;
}

export interface BoardLayout {
  orientation: 'vertical' | 'horizontal';
  /** Board or strip face width and the gap between boards. */
  boardWidth: number;
  gap: number;
  count: number;
  lastWidth: number;
  leftover: number;
  /** Width of the first board when it is ripped too (a balanced layout: the same as the last). */
  firstWidth?: number;
}

export interface WallTakeoff {
  label: string;
  length: number;
  ceilingHeight: number;
  /** The covered band runs from the top of the baseboard to the top of the treatment. */
  bandBottom: number;
  bandTop: number;
  coveredHeight: number;
  grossSqFt: number;
  openingsSqFt: number;
  netSqFt: number;
  openings: PlacedOpening[];
  /** Fixtures on the wall, placed; the area the stopping ones keep uncovered is `fixturesSqFt`. */
  fixtures?: PlacedFixture[];
  fixturesSqFt?: number;
  boxes: PlacedBox[];
  cutOuts: number;
  returns: number;
  boards?: BoardLayout;
  /** Picture frames: how many, and their average width and height (frames under a window's sill are shorter). */
  frames?: { count: number; width: number; height: number };
  /** On a stair wall: the nosing line's low and high ends, in wall inches (stair-wall.ts, docs/sources.md §40). */
  rake?: [{ x: number; y: number }, { x: number; y: number }];
  /** On a stair wall: ends cut to the stair's angle, and the skirt board's length along the rake (feet). */
  rakeCuts?: number;
  skirtFeet?: number;
  pieces: WallPiece[];
  capRailFeet: number;
  baseboardFeet: number;
  notes: string[];
}

export interface RoomTakeoff {
  name: string;
  treatmentId: string;
  treatmentName: string;
  treatmentKind: TreatmentKind;
  /** In a damp room priced with the firm's moisture-resistant alternative: the treatment that was chosen. */
  dampAlternativeFor?: string;
  height: 'wainscot' | 'full';
  ceilingHeight: number;
  bandTop: number;
  walls: WallTakeoff[];
  grossSqFt: number;
  netSqFt: number;
  /** Area the firm primes and paints (net band area; zero when the firm does not paint). */
  paintSqFt: number;
  cutOuts: number;
  returns: number;
  insideCorners: number;
  outsideCorners: number;
  capRailFeet: number;
  baseboardFeet: number;
  baseboardRemovedFeet: number;
  /** The old baseboard is taken off and reset on the new work, which would stand proud of it. */
  baseboardReset?: boolean;
  /** Back band added around casings the new work stands proud of (docs/sources.md §31). */
  backBandFeet?: number;
  /** Stair walls: skirt board along the rake (feet) and ends cut to the stair's angle (stair-takeoff.ts). */
  skirtFeet?: number;
  rakeCuts?: number;
  /** Windows whose stool and apron are taken off and refitted, the new work standing proud of the stool (docs/sources.md §51). */
  stoolRefits?: number;
  /** Painted surface disturbed by the work (removed baseboard counts in full), for the lead-safe rule. */
  disturbedPaintSqFt: number;
  /** Area of boards or sheets glued and nailed to the wall (drives adhesive, brads and filler). */
  panelSqFt: number;
  /** Trim run (battens, stiles, rails, frames, cap rail, new baseboard), feet: drives brads. */
  trimFeet: number;
  /** Joints to caulk, feet. */
  caulkFeet: number;
  damp: boolean;
}

export interface MaterialLine {
  id: string;
  label: string;
  /** Units to buy, after waste and rounding up to whole units. */
  quantity: number;
  unit: 'sheet' | 'piece' | 'box' | 'tube' | 'gallon' | 'each' | 'set';
  /** What the quantity was worked out from, before waste and rounding. */
  needed: number;
  unitCents: number;
  basis: string;
  /** For sheets: pieces per sheet of the commonest piece. */
  piecesPerSheet?: number;
  /** For stock lengths: the cuts that come from them. */
  cuts?: number;
  stockLength?: number;
  /** For paint and primer: the containers bought, largest first (containers.ts). */
  packs?: Array<{ name: string; gallons: number; priceCents: number; count: number }>;
}

export interface Caution {
  id: 'electrical-boxes' | 'cap-rail-box' | 'lead-safe' | 'damp-room' | 'wet-zone' | 'ladder' | 'tools' | 'fixture-trades' | 'stair';
  title: string;
  text: string;
  rooms: string[];
}

export interface Takeoff {
  units: Units;
  rooms: RoomTakeoff[];
  grossSqFt: number;
  netSqFt: number;
  paintSqFt: number;
  cutOuts: number;
  materials: MaterialLine[];
  cautions: Caution[];
  /** Project facts the price depends on, copied so a takeoff can be priced on its own. */
  facts: {
    paint: boolean;
    builtBefore1978: 'yes' | 'no' | 'not-sure';
    measuredBy: MeasuredBy;
    photoCount: number;
    tripZone?: string;
  };
  notes: string[];
}

export interface LabourLine {
  task:
    | 'install'
    | 'cut-outs'
    | 'returns'
    | 'corners'
    | 'baseboard-removal'
    | 'baseboard'
    | 'cap-rail'
    | 'back-band'
    | 'skirt-board'
    | 'rake-cuts'
    | 'stool-refit'
    | 'paint'
    | 'setup'
    | 'fixture-reset'
    | 'fixture-scribe';
  label: string;
  hours: number;
  basis: string;
}

export interface PriceLine {
  group: 'materials' | 'markup' | 'labour' | 'extras' | 'tax' | 'minimum';
  label: string;
  quantity: number;
  unit: string;
  unitCents: number;
  totalCents: number;
  basis: string;
}

/** The crew's trips to the house (site-visits.ts), each carrying set-up and clean-up. */
export interface SiteVisits {
  total: number;
  installDays: number;
  /** 1 when the firm paints: caulk and fill before the first coat. */
  caulkAndFill: number;
  primerCoats: number;
  paintCoats: number;
  setupHoursEach: number;
}

export interface Price {
  currency: string;
  locale: string;
  labour: LabourLine[];
  labourHours: number;
  visits?: SiteVisits;
  lines: PriceLine[];
  materialsCents: number;
  markupCents: number;
  labourCents: number;
  extrasCents: number;
  taxCents: number;
  /** Before the minimum job. */
  subtotalCents: number;
  totalCents: number;
  minimumApplied: boolean;
  lowCents: number;
  highCents: number;
  spread: { below: number; above: number; basis: string };
  /** The rate book's rounding step for the range; the homeowner's breakdown is rounded to it too. Absent in older snapshots. */
  roundingCents?: number;
  /** The range as people read it, e.g. "$4,350 – $5,900". */
  rangeText: string;
}

export interface Estimate {
  takeoff: Takeoff;
  price: Price;
}
