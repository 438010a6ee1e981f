/**
 * The takeoff: per wall and per room, the covered band, areas, openings, boxes, board layout, the
 * pieces of material on the wall and the cuts they need; then the project's materials and cautions.
 */
import { balancedRun, positionsOf } from './balanced-run.ts';
import { boardPositions, boardRun } from './board-run.ts';
import { baseboardNeedsReset, backBandRuns, CASING_REVEAL, newFaceThickness, proudOfCasing } from './build-up.ts';
import { blockedAreaSqIn, casingBlock } from './casings.ts';
import { cautionsFor } from './cautions.ts';
import { defaultInsideCorners } from './corners.ts';
import { blockedBy, tryPlaceFixtures } from './fixtures.ts';
import { DEFAULT_DOOR, DEFAULT_WINDOW, OPENING_SPACING, overlap, placeBoxes, placeOpenings, subtractIntervals, type Interval } from './geometry.ts';
import { lengthKey, materialsFor, type CutRegistry } from './materials.ts';
import type { BoardStock, Catalogue, Project, Room, SheetStock, Treatment, Wall } from './schemas.ts';
import type { BoardLayout, PlacedOpening, RoomTakeoff, Takeoff, WallPiece, WallTakeoff } from './types.ts';
import { stockCutFor, stockLengthsOf } from './stock-lengths.ts';
import { staggeredRow } from './staggered-joints.ts';
import { formatLength, type Units } from './units.ts';
import { checkProjectSize } from './project-size.ts';
import { treatmentForRoom } from './damp-stock.ts';
import { validateProject } from './validate.ts';
import { skirtStock } from './stair-checks.ts';
import { columnRakeCuts, developed, footFirst, liftAt, rakedColumnTop, rakeOf, runRakeCuts, undeveloped, type Rake } from './stair-takeoff.ts';
import { rakedBandArea, skirtLength, stairNotes } from './stair-wall.ts';
import { fromStairFoot, spreadEvenly } from './upright-positions.ts';
import { proudOfStool, stoolAndApronSqIn, windowsWithStoolInBand } from './window-stool.ts';
import { bandTopFor, wallLength } from './wall-band.ts';

export { bandTopFor, wallLength };

const MIN_PIECE = 0.5; // pieces shorter than half an inch are not cut

/** Whether the treatment puts boards or sheets over the whole band (so boxes inside it need cut-outs and extenders). */
export function coversWall(t: Treatment): boolean {
  switch (t.kind) {
    case 'shiplap':
    case 'beadboard':
      return true;
    case 'board-and-batten':
    case 'flat-panel':
      return t.backingSheetId !== undefined;
    case 'picture-frame':
      return false;
  }
}

/** Splits a run longer than `max` into full lengths and a remainder. */
function splitFull(len: number, max: number): number[] {
  const out: number[] = [];
  let rest = len;
  while (rest > max + 1e-9) {
    out.push(max);
    rest -= max;
  }
  if (rest >= MIN_PIECE) out.push(rest);
  return out;
}

/** Splits a trim run into equal pieces that each fit the stock once both end allowances are added. */
function trimCuts(len: number, stock: number, allowance: number): number[] {
  const usable = Math.max(1, stock - 2 * allowance);
  const n = Math.max(1, Math.ceil(len / usable - 1e-9));
  return Array.from({ length: n }, () => Math.min(stock, len / n + 2 * allowance));
}

function addCuts(map: Map<string, number[]>, id: string, cuts: number[]): void {
  const list = map.get(id);
  if (list) list.push(...cuts);
  else map.set(id, [...cuts]);
}
function addSheetPiece(reg: CutRegistry, id: string, width: number, height: number): void {
  const list = reg.sheets.get(id);
  const piece = { width, height };
  if (list) list.push(piece);
  else reg.sheets.set(id, [piece]);
}

interface WallContext {
  length: number;
  bandBottom: number;
  bandTop: number;
  openings: PlacedOpening[];
  pieces: WallPiece[];
  reg: CutRegistry;
  catalogue: Catalogue;
  trimFeet: number;
  caulkFeet: number;
  /** Scarf joints where a run is longer than any stock length. */
  joints: number;
  /** On a stair wall: the stair, and the layout is in the frame measured up from its nosing line (stair-takeoff.ts). */
  rake?: Rake;
  /** Ends cut to the stair's angle. */
  rakeCuts: number;
}

/** Vertical stretches of the band in the column [x0, x1] that no opening interrupts. */
function columnIntervals(ctx: WallContext, x0: number, x1: number, bottom = ctx.bandBottom, top = ctx.bandTop): Interval[] {
  // On a stair wall a column is cut at its long point (stair-takeoff.ts).
  if (ctx.rake) top = rakedColumnTop(ctx.rake, x0, x1, top);
  const cuts = ctx.openings.filter((o) => overlap(o.offset, o.offset + o.width, x0, x1) > 0.01).map((o) => [o.sillHeight, o.sillHeight + o.height] as const);
  return subtractIntervals([bottom, top], cuts, MIN_PIECE);
}

/**
 * A column [x0, x1] split at the edges of openings, each slice with its own vertical stretches: a board
 * or panel that straddles a door edge is notched around it rather than left out.
 */
function columnSlices(
  ctx: WallContext,
  x0: number,
  x1: number,
  bottom = ctx.bandBottom,
  top = ctx.bandTop,
): Array<{ x0: number; x1: number; spans: Interval[] }> {
  // Most columns meet no opening: one slice, the whole band (what the general path gives then).
  if (
    !ctx.openings.some(
      (o) => overlap(o.offset, o.offset + o.width, x0, x1) > 0.01 || (o.offset > x0 && o.offset < x1) || (o.offset + o.width > x0 && o.offset + o.width < x1),
    )
  ) {
    const colTop = ctx.rake ? rakedColumnTop(ctx.rake, x0, x1, top) : top;
    return x1 - x0 >= 0.01 && colTop - bottom >= MIN_PIECE ? [{ x0, x1, spans: [[bottom, colTop]] }] : [];
  }
  const edges = [x0, x1];
  for (const o of ctx.openings) {
    if (o.offset > x0 + 0.01 && o.offset < x1 - 0.01) edges.push(o.offset);
    const end = o.offset + o.width;
    if (end > x0 + 0.01 && end < x1 - 0.01) edges.push(end);
  }
  edges.sort((a, b) => a - b);
  const out: Array<{ x0: number; x1: number; spans: Interval[] }> = [];
  for (let i = 0; i + 1 < edges.length; i++) {
    const a = edges[i]!;
    const b = edges[i + 1]!;
    if (b - a < 0.01) continue;
    const spans = columnIntervals(ctx, a, b, bottom, top);
    if (spans.length > 0) out.push({ x0: a, x1: b, spans });
  }
  return out;
}

/** The lengths to cut for one column: the union of its slices' stretches (a notched board is one board). */
function columnCuts(slices: Array<{ spans: Interval[] }>): Interval[] {
  // One slice: its stretches are already in order and apart (subtractIntervals).
  if (slices.length === 1) return slices[0]!.spans.map(([a, b]) => [a, b]);
  const all = slices.flatMap((s) => s.spans).sort((a, b) => a[0] - b[0]);
  const merged: Array<[number, number]> = [];
  for (const [a, b] of all) {
    const last = merged.at(-1);
    if (last && a <= last[1] + 1e-6) last[1] = Math.max(last[1], b);
    else merged.push([a, b]);
  }
  return merged;
}

/** Horizontal stretches of the wall in the row [y0, y1] that no opening interrupts. */
function rowIntervals(ctx: WallContext, y0: number, y1: number, x0 = 0, x1 = ctx.length): Interval[] {
  const cuts = ctx.openings.filter((o) => overlap(o.sillHeight, o.sillHeight + o.height, y0, y1) > 0.01).map((o) => [o.offset, o.offset + o.width] as const);
  return subtractIntervals([x0, x1], cuts, MIN_PIECE);
}

function sheetById(c: Catalogue, id: string): SheetStock {
  return c.sheets.find((s) => s.id === id)!;
}
function boardById(c: Catalogue, id: string): BoardStock {
  return c.boards.find((s) => s.id === id)!;
}

interface RunPlan {
  layout: Omit<BoardLayout, 'orientation' | 'boardWidth' | 'gap'>;
  positions: Array<{ start: number; width: number; ripped: boolean }>;
}

/** Boards (or sheets) across a run, set out from the left end or balanced, as the treatment says. */
function runPlan(layout: Treatment['layout'], runLength: number, width: number, gap: number): RunPlan {
  if (layout === 'balanced') {
    const run = balancedRun(runLength, width, gap);
    const positions = positionsOf(run, width, gap).map((p) => ({ start: p.start, width: p.width, ripped: p.width < width - 1e-6 }));
    return { layout: { count: run.count, lastWidth: run.endWidth, leftover: 0, firstWidth: run.endWidth }, positions };
  }
  const run = boardRun(runLength, width, gap);
  const positions = boardPositions(runLength, width, gap).map((p, i) => ({
    start: p.start,
    width: p.width,
    ripped: i === run.count - 1 && run.lastWidth < width - 1e-6,
  }));
  return { layout: run, positions };
}

/**
 * How columns of boards, strips or panels are set out along the wall. On a stair wall they go from
 * the stair's foot, full widths first, whatever the treatment says: balanced ends would move every
 * column over the stair as the wall grew and change its long point (docs/sources.md §43).
 */
function columnLayout(ctx: WallContext, t: Treatment): Treatment['layout'] {
  return ctx.rake ? 'from-left' : t.layout;
}

/** Panels or backing sheets laid side by side across the wall, full sheet width, butted. */
function layPanels(ctx: WallContext, sheet: SheetStock, role: 'panel', t: Treatment): void {
  const longSide = Math.max(sheet.width, sheet.height);
  for (const col of footFirst(ctx.rake, ctx.length, runPlan(columnLayout(ctx, t), ctx.length, sheet.width, 0).positions)) {
    const slices = columnSlices(ctx, col.start, col.start + col.width);
    for (const sl of slices) {
      for (const [y0, y1] of sl.spans) ctx.pieces.push({ role, x: sl.x0, y: y0, width: sl.x1 - sl.x0, height: y1 - y0, ripped: col.ripped });
    }
    // A panel notched around an opening still comes from one piece of the sheet.
    for (const [y0, y1] of columnCuts(slices)) {
      for (const len of splitFull(y1 - y0, longSide)) addSheetPiece(ctx.reg, sheet.id, col.width, len);
    }
  }
  if (ctx.rake) ctx.rakeCuts += columnRakeCuts(ctx.rake, sheet.width);
}

function layShiplap(ctx: WallContext, t: Extract<Treatment, { kind: 'shiplap' }>): BoardLayout {
  const fromSheet = t.source.from === 'sheet';
  const sheet = t.source.from === 'sheet' ? sheetById(ctx.catalogue, t.source.sheetId) : undefined;
  const board = t.source.from === 'boards' ? boardById(ctx.catalogue, t.source.boardId) : undefined;
  const faceWidth = t.source.from === 'sheet' ? t.source.stripWidth : board!.faceWidth;
  const maxLen = sheet ? Math.max(sheet.width, sheet.height) : board!.length;
  const role: WallPiece['role'] = fromSheet ? 'strip' : 'board';
  const cut = (len: number): void => {
    if (sheet) addSheetPiece(ctx.reg, sheet.id, faceWidth, len);
    else addCuts(ctx.reg.lengths, board!.id, [len]);
  };
  const put = (x: number, y: number, w: number, h: number, len: number, ripped: boolean): void => {
    ctx.pieces.push({ role, x, y, width: w, height: h, ripped });
    cut(len);
  };
  if (t.orientation === 'vertical') {
    const plan = runPlan(columnLayout(ctx, t), ctx.length, faceWidth, t.gap);
    footFirst(ctx.rake, ctx.length, plan.positions).forEach((b) => {
      const ripped = b.ripped;
      const slices = columnSlices(ctx, b.start, b.start + b.width);
      for (const sl of slices) for (const [y0, y1] of sl.spans) ctx.pieces.push({ role, x: sl.x0, y: y0, width: sl.x1 - sl.x0, height: y1 - y0, ripped });
      for (const [y0, y1] of columnCuts(slices)) for (const len of splitFull(y1 - y0, maxLen)) cut(len);
    });
    if (ctx.rake) ctx.rakeCuts += columnRakeCuts(ctx.rake, faceWidth + t.gap);
    return { orientation: 'vertical', boardWidth: faceWidth, gap: t.gap, ...plan.layout };
  }
  const height = ctx.bandTop - ctx.bandBottom;
  const plan = runPlan(t.layout, height, faceWidth, t.gap);
  // Joints on studs, clear of the joints in the row below (staggered-joints.ts).
  let below: number[] = [];
  plan.positions.forEach((b) => {
    const ripped = b.ripped;
    const y = ctx.bandBottom + b.start;
    const joints: number[] = [];
    for (const [x0, x1] of rowIntervals(ctx, y, y + b.width)) {
      const row = rowRun(ctx, x0, x1, maxLen, below, false);
      joints.push(...row.joints);
      for (const p of row.pieces) if (p.len >= MIN_PIECE) put(p.x, y, p.width, b.width, p.len, ripped);
    }
    below = joints;
  });
  return { orientation: 'horizontal', boardWidth: faceWidth, gap: t.gap, ...plan.layout };
}

/**
 * Edges of an upright that need their own bead: an edge on a wall end is the corner's (or the end's)
 * joint, and an edge against a door or window side is the opening's, both counted once elsewhere.
 */
function uprightEdgesToCaulk(ctx: WallContext, x: number, w: number, y0: number, y1: number): number {
  const beside = (edge: number): boolean =>
    ctx.openings.some(
      (o) => (Math.abs(o.offset - edge) < 1e-6 || Math.abs(o.offset + o.width - edge) < 1e-6) && overlap(o.sillHeight, o.sillHeight + o.height, y0, y1) > 0.01,
    );
  const shared = (edge: number): boolean => edge < 1e-6 || edge > ctx.length - 1e-6 || beside(edge);
  return (shared(x) ? 0 : 1) + (shared(x + w) ? 0 : 1);
}

/** Vertical members (battens or stiles), one at each wall end, no more than `spacing` apart on centre (upright-positions.ts). */
function layUprights(ctx: WallContext, board: BoardStock, spacing: number, bottom: number, top: number, role: 'batten' | 'stile'): void {
  const w = board.width;
  if (top - bottom < MIN_PIECE) return;
  // Each stretch of wall between the wall ends and the openings (casings included) that cross the
  // band gets its own uprights: one against each end of the stretch (so one stands against every
  // casing, none straddles it) and the rest spread evenly, no more than `spacing` apart on centre.
  // Openings are placed from the left end, so a longer wall only lengthens the last stretch and only
  // ever adds uprights; spread over the whole wall and moved off the openings they land on, uprights
  // would stack on one another and their number would rise and fall with the wall's length.
  const blockers = ctx.openings.filter((o) => overlap(o.sillHeight, o.sillHeight + o.height, bottom, top) > 0.01);
  const blocked = blockers.map((o) => [o.offset, o.offset + o.width] as const);
  if (ctx.rake) ctx.rakeCuts += columnRakeCuts(ctx.rake, spacing);
  // Under an opening whose sill leaves room below it, the space under the sill is a stretch of its
  // own (columnIntervals stops its uprights at the sill): dropped, a band rising past a sill would
  // lose those uprights and cost less (docs/sources.md §52, as for picture frames).
  const underSills = blockers.flatMap((o, i) =>
    o.sillHeight - bottom < MIN_PIECE
      ? []
      : subtractIntervals(
          [Math.max(0, o.offset), Math.min(ctx.length, o.offset + o.width)],
          blocked.filter((_, j) => j !== i),
          w - 1e-9,
        ),
  );
  const rake = ctx.rake;
  for (const [a, b] of [...subtractIntervals([0, ctx.length], blocked, w - 1e-9), ...underSills]) {
    // On a stair wall the stretch that holds the stair is set out from its foot: spread evenly, a
    // longer stretch would move every upright over the stair and change its long point
    // (docs/sources.md §43). No opening sits over the stair, so one stretch holds all of it.
    const holdsStair = rake !== undefined && a <= rake.span[0] + 1e-9 && b >= rake.span[1] - 1e-9;
    const xs = holdsStair ? fromStairFoot(a, b, w, spacing, rake.span[1] - rake.span[0], rake.stair.startsAt) : spreadEvenly(a, b, w, spacing);
    for (const x of xs) {
      for (const [y0, y1] of columnIntervals(ctx, x, x + w, bottom, top)) {
        let y = y0;
        for (const len of splitFull(y1 - y0, board.length)) {
          ctx.pieces.push({ role, x, y, width: w, height: len });
          addCuts(ctx.reg.lengths, board.id, [len]);
          ctx.trimFeet += len / 12;
          ctx.caulkFeet += (uprightEdgesToCaulk(ctx, x, w, y, y + len) * len) / 12;
          y += len;
        }
      }
    }
  }
}

/**
 * A horizontal rail across the wall at [y, y + board width], broken by openings. `edgesToCaulk` is 1
 * where one of its edges is another joint's already (a top rail under the cap rail or the ceiling).
 */
function layRail(ctx: WallContext, board: BoardStock, y: number, edgesToCaulk: 1 | 2 = 2): void {
  // On a stair wall a rail follows the rake, except a top rail under a level ceiling (in the nosing
  // frame, the ceiling over the level part is the stair's climb lower).
  const level = ctx.rake !== undefined && ctx.rake.full && y + board.width >= ctx.bandTop - 1e-6;
  const yRow = level ? y - ctx.rake!.g.climb : y;
  for (const [x0, x1] of rowIntervals(ctx, yRow, yRow + board.width)) {
    // A rail longer than the stock is joined on a stud (staggered-joints.ts).
    for (const p of rowRun(ctx, x0, x1, board.length, [], level).pieces) {
      if (p.len < MIN_PIECE) continue;
      ctx.pieces.push({ role: 'rail', x: p.x, y: yRow, width: p.width, height: board.width });
      addCuts(ctx.reg.lengths, board.id, [p.len]);
      ctx.trimFeet += p.len / 12;
      ctx.caulkFeet += (edgesToCaulk * p.len) / 12;
    }
  }
}

/**
 * The pieces of one run [x0, x1] across the wall, joined on studs clear of the joints `below`. On a
 * stair wall a run that meets the rake is laid out along the nosing line, so its pieces have their
 * true lengths (`len`) while `x` and `width` stay on the wall for drawings; its rake cuts are counted.
 * A run on a stair wall that does not meet the rake (beyond a door on the landing) is laid out on the
 * wall, its studs counted from the wall's left end as on any wall: measured along the nosing line, its
 * studs would shift with the stair's length, and a stair with more steps could cost less
 * (docs/sources.md §43).
 */
function rowRun(
  ctx: WallContext,
  x0: number,
  x1: number,
  stock: number,
  below: number[],
  level: boolean,
): { pieces: Array<{ x: number; width: number; len: number }>; joints: number[] } {
  const onRake = !level && ctx.rake !== undefined && Math.min(x1, ctx.rake.span[1]) - Math.max(x0, ctx.rake.span[0]) > 1e-9;
  const r = onRake ? ctx.rake : undefined;
  const u0 = r ? developed(r, x0) : x0;
  const u1 = r ? developed(r, x1) : x1;
  // Joints are kept in wall positions, so the rows above compare them whichever frame their runs use.
  const row = staggeredRow({ x0: u0, x1: u1, stock, studSpacing: ctx.catalogue.studSpacing, below: r ? below.map((x) => developed(r, x)) : below });
  const pieces: Array<{ x: number; width: number; len: number }> = [];
  let u = u0;
  for (const len of row.pieces) {
    const x = r ? undeveloped(r, u) : u;
    const end = r ? undeveloped(r, u + len) : u + len;
    pieces.push({ x, width: end - x, len });
    u += len;
  }
  if (r) ctx.rakeCuts += runRakeCuts(r, x0, x1);
  return { pieces, joints: r ? row.joints.map((j) => undeveloped(r, j)) : row.joints };
}

/** A stretch of wall that takes a line of frames: between openings, or under one window's sill. */
interface FrameStretch {
  x0: number;
  x1: number;
  /** Top of the frames here: the frames' top, or a margin under the sill of the window above. */
  top: number;
  underSill: boolean;
}

/**
 * Where frames go on a wall: the stretches between openings (each opening and a margin around it left
 * clear), and under each window the space below its sill, less the margin, where the frames are
 * shorter. Every opening splits the frames whatever the band's height, so the stretches do not change
 * as the band rises past a sill: the frames under it only stop growing, and none is dropped (a line
 * of frames that re-divided around a window once the band reached its sill could cost less).
 */
function frameStretches(ctx: WallContext, margin: number, bottom: number, top: number, minSide: number): FrameStretch[] {
  const clear = ctx.openings.map((o) => [o.offset - margin, o.offset + o.width + margin] as const);
  const out: FrameStretch[] = subtractIntervals([margin, ctx.length - margin], clear, minSide).map(([x0, x1]) => ({ x0, x1, top, underSill: false }));
  ctx.openings.forEach((o, i) => {
    // A door (or a fixture from the floor) leaves no room under it: its sill is at the floor.
    const underTop = Math.min(top, o.sillHeight - margin);
    if (underTop - bottom < minSide) return;
    const others = clear.filter((_, j) => j !== i);
    for (const [x0, x1] of subtractIntervals([Math.max(margin, o.offset), Math.min(ctx.length - margin, o.offset + o.width)], others, minSide)) {
      out.push({ x0, x1, top: underTop, underSill: true });
    }
  });
  return out.sort((p, q) => p.x0 - q.x0);
}

function layFrames(ctx: WallContext, t: Extract<Treatment, { kind: 'picture-frame' }>, rows: number): WallTakeoff['frames'] {
  const moulding = ctx.catalogue.mouldings.find((m) => m.id === t.mouldingId)!;
  const lengths = stockLengthsOf(moulding);
  const m = t.margin;
  const bottom = ctx.bandBottom + m;
  const top = ctx.bandTop - m;
  const hb = top - bottom;
  const fh = (hb - (rows - 1) * t.frameGap) / rows;
  // A frame narrower or shorter than about three moulding widths has no opening left to read as a frame.
  const minSide = Math.max(6, 3 * moulding.width);
  if (fh < minSide) return { count: 0, width: 0, height: 0 };
  let count = 0;
  let widthSum = 0;
  let heightSum = 0;
  const frame = (x: number, y: number, fw: number, h: number): void => {
    ctx.pieces.push({ role: 'frame', x, y, width: fw, height: h });
    // Source: docs/sources.md §12 — for a 45° miter the long point equals the frame's outside dimension (common geometry).
    for (const side of [fw, fw, h, h]) {
      // A side longer than the moulding comes from a longer length the firm lists, or is joined.
      const cut = stockCutFor(lengths, side, moulding.thickness);
      addCuts(ctx.reg.lengths, lengthKey(moulding, cut.stockLength), cut.pieces);
      ctx.joints += cut.joints;
    }
    ctx.trimFeet += (2 * (fw + h)) / 12;
    ctx.caulkFeet += (4 * (fw + h)) / 12; // outer and inner edges
    count += 1;
    widthSum += fw;
    heightSum += h;
  };
  for (const st of frameStretches(ctx, m, bottom, top, minSide)) {
    const s = st.x1 - st.x0;
    // Frames keep the target width (or the whole stretch, when it is narrower) and as many as fit are
    // centred in the stretch, the rest going to the margins. Re-dividing a longer stretch into more,
    // narrower frames would change every piece, and shorter pieces can pack into fewer stock lengths,
    // so a longer wall could cost less; with a fixed width a longer stretch only ever adds frames.
    const fw = Math.min(s, Math.max(t.targetFrameWidth, minSide));
    const n = Math.max(1, Math.floor((s + t.frameGap) / (fw + t.frameGap) + 1e-9));
    const start = st.x0 + (s - (n * fw + (n - 1) * t.frameGap)) / 2;
    for (let i = 0; i < n; i++) {
      const x = start + i * (fw + t.frameGap);
      // Under a sill, one frame fills the space below it: rows there would re-divide as the band grew.
      if (st.underSill) frame(x, bottom, fw, st.top - bottom);
      else for (let r = 0; r < rows; r++) frame(x, bottom + r * (fh + t.frameGap), fw, fh);
    }
  }
  return { count, width: count ? widthSum / count : 0, height: count ? heightSum / count : 0 };
}

/**
 * Where the new face stands proud of the casings on a wall's openings in the band: a back band around
 * each (cut and counted as trim) when the rate book names one, otherwise a note. Returns its feet.
 */
function backBandAtCasings(ctx: WallContext, openings: PlacedOpening[], t: Treatment, label: string, units: Units, notes: string[]): number {
  const cased = openings.filter((o) => o.inBand && (o.casingWidth ?? 0) > 0);
  const face = newFaceThickness(t, ctx.catalogue);
  const casing = ctx.catalogue.casing.thickness;
  if (cased.length === 0 || proudOfCasing(face, casing) <= 0) return 0;
  const why = `the new face (${formatLength(face, units)} thick) stands proud of the ${formatLength(casing, units)} casings, which it should stay ${formatLength(CASING_REVEAL, units)} behind`;
  const band = ctx.catalogue.mouldings.find((m) => m.id === ctx.catalogue.backBandId);
  if (!band) {
    notes.push(`On ${label}, ${why}: the casings stand behind the new face and need a back band or furring, not priced here.`);
    return 0;
  }
  let inches = 0;
  for (const o of cased) {
    for (const run of backBandRuns(o)) {
      addCuts(ctx.reg.lengths, band.id, trimCuts(run, band.length, ctx.catalogue.trimEndAllowance));
      inches += run;
    }
  }
  const feet = inches / 12;
  ctx.trimFeet += feet;
  notes.push(
    `On ${label}, ${why}, so a back band (${band.name}) goes around ${cased.length === 1 ? 'the casing' : `${cased.length} casings`}: ${Math.round(feet * 10) / 10} ft.`,
  );
  return feet;
}

/**
 * Windows on a wall whose stool the new work meets and would stand proud of: their stool and apron are
 * taken off and refitted (window-stool.ts), with a note. Returns how many, and the painted surface
 * that comes off with them.
 */
function stoolRefitsOnWall(
  openings: PlacedOpening[],
  bandBottom: number,
  bandTop: number,
  t: Treatment,
  catalogue: Catalogue,
  label: string,
  units: Units,
  notes: string[],
): { length: number; paintSqIn: number } {
  const met = windowsWithStoolInBand(openings, bandBottom, bandTop);
  if (met.length === 0 || proudOfStool(t, catalogue) <= 0) return { length: 0, paintSqIn: 0 };
  const out = newFaceThickness(t, catalogue) + catalogue.casing.thickness;
  notes.push(
    `On ${label}, the new face with the apron reset on it stands ${formatLength(out, units)} out from the wall, past the ${formatLength(catalogue.stoolProjection, units)} window ${met.length === 1 ? 'stool' : 'stools'}, which should stay ${formatLength(CASING_REVEAL, units)} further out: the stool and apron ${met.length === 1 ? 'of the window are' : `of ${met.length} windows are`} taken off and refitted (extended, re-cut or replaced).`,
  );
  return { length: met.length, paintSqIn: met.reduce((sum, o) => sum + stoolAndApronSqIn(o, catalogue), 0) };
}

function wallTakeoff(
  room: Room,
  wall: Wall,
  index: number,
  t: Treatment,
  catalogue: Catalogue,
  reg: CutRegistry,
  units: Units,
): {
  wall: WallTakeoff;
  trimFeet: number;
  caulkFeet: number;
  backBandFeet: number;
  rakeCuts: number;
  skirtFeet: number;
  stoolRefits: number;
  stoolPaintSqIn: number;
} {
  const length = wallLength(room, wall);
  const baseboard = catalogue.mouldings.find((m) => m.id === catalogue.baseboardId)!;
  const capRail = catalogue.mouldings.find((m) => m.id === catalogue.capRailId)!;
  const wainscot = room.treatment.height === 'wainscot';
  // A stair wall is laid out up from its nosing line (stair-takeoff.ts); the band starts on the skirt board.
  const rake = wall.stair ? rakeOf(length, wall.stair, !wainscot) : undefined;
  const skirt = rake ? skirtStock(catalogue) : undefined;
  const bandBottom = skirt ? skirt.width : baseboard.width;
  const bandTop = bandTopFor(room);
  // Doors, windows, boxes and fixtures on the level part of a stair wall stand on the landing: in the
  // nosing frame, a full-height band there ends the stair's climb below the ceiling.
  const levelTop = rake?.full ? bandTop - rake.g.climb : bandTop;
  const openings: PlacedOpening[] = placeOpenings(wall.openings, length, catalogue.casing.width).map((o) => {
    const block = casingBlock({ ...o, inBand: false }, length);
    return { ...o, inBand: overlap(block.sillHeight, block.sillHeight + block.height, bandBottom, levelTop) > 0 };
  });
  // Layouts, areas, boxes, caulk and returns see each opening with its casing: the treatment stops at
  // the casing's outside edge, and an upright set beside an opening lands against the casing.
  const blocks = openings.map((o) => casingBlock(o, length));
  const placedFixtures = tryPlaceFixtures(wall.fixtures, length, openings);
  const fixtures = placedFixtures.ok ? placedFixtures.fixtures : [];
  // A fixture the treatment stops at is laid out like an opening from the floor (not a door or
  // window, so no return or caulk at its edges is counted here; the scribing is its own labour).
  const fixtureBlocks: PlacedOpening[] = fixtures.flatMap((f) => {
    const b = blockedBy(f, room.ceilingHeight);
    return b ? [{ kind: 'window' as const, ...b, inBand: overlap(b.sillHeight, b.sillHeight + b.height, bandBottom, levelTop) > 0, assumed: f.assumed }] : [];
  });
  const covers = coversWall(t);
  const boxes = placeBoxes(wall, length, [...blocks, ...fixtureBlocks]).map((b) => ({
    ...b,
    covered: covers && overlap(b.bottom, b.bottom + b.height, bandBottom, rake ? rakedColumnTop(rake, b.offset, b.offset + b.width, bandTop) : bandTop) > 0,
    capRailCrosses: wainscot && overlap(b.bottom, b.bottom + b.height, bandTop, bandTop + capRail.width) > 0,
  }));
  const coveredHeight = bandTop - bandBottom;
  // On a stair wall the band follows the nosing line (docs/sources.md §40): vertical height × length
  // for a wainscot, less the triangle under the rake for full height.
  const grossSqIn = rake ? rakedBandArea(length, rake.g, bandBottom, wainscot ? { wainscot: bandTop } : { ceiling: bandTop }) : length * coveredHeight;
  // Each stretch of wall comes off once, where casings and fixtures meet or overlap.
  const openingsSqIn = blockedAreaSqIn(blocks, length, bandBottom, levelTop);
  const fixturesSqIn = blockedAreaSqIn([...blocks, ...fixtureBlocks], length, bandBottom, levelTop) - openingsSqIn;
  const ctx: WallContext = {
    length,
    bandBottom,
    bandTop,
    openings: [...blocks, ...fixtureBlocks],
    pieces: [],
    reg,
    catalogue,
    trimFeet: 0,
    caulkFeet: 0,
    joints: 0,
    ...(rake ? { rake } : {}),
    rakeCuts: 0,
  };
  const notes: string[] = [];
  const label = wall.label ?? `Wall ${index + 1}`;
  let boards: BoardLayout | undefined;
  let frames: WallTakeoff['frames'];

  switch (t.kind) {
    case 'shiplap':
      boards = layShiplap(ctx, t);
      break;
    case 'beadboard':
      layPanels(ctx, sheetById(catalogue, t.sheetId), 'panel', t);
      break;
    case 'board-and-batten': {
      if (t.backingSheetId) layPanels(ctx, sheetById(catalogue, t.backingSheetId), 'panel', t);
      const rail = t.topRailId ? boardById(catalogue, t.topRailId) : undefined;
      const top = rail ? bandTop - rail.width : bandTop;
      layUprights(ctx, boardById(catalogue, t.battenId), t.battenSpacing, bandBottom, top, 'batten');
      // The top rail's top edge is the cap rail's bottom edge (or the ceiling joint).
      if (rail) layRail(ctx, rail, top, 1);
      break;
    }
    case 'flat-panel': {
      if (t.backingSheetId) layPanels(ctx, sheetById(catalogue, t.backingSheetId), 'panel', t);
      const rail = boardById(catalogue, t.railId);
      // The bottom rail's bottom edge is the new baseboard's top joint when that is counted; the top
      // rail's top edge is the cap rail's bottom edge (or the ceiling joint).
      layRail(ctx, rail, bandBottom, room.replaceBaseboard || baseboardNeedsReset(t, catalogue) ? 1 : 2);
      layRail(ctx, rail, bandTop - rail.width, 1);
      layUprights(ctx, boardById(catalogue, t.stileId), t.stileSpacing, bandBottom + rail.width, bandTop - rail.width, 'stile');
      break;
    }
    case 'picture-frame':
      frames = layFrames(ctx, t, wainscot ? 1 : t.fullHeightRows);
      break;
  }

  // Cap rail along the top of a wainscot, broken where an opening crosses it.
  let capRailFeet = 0;
  if (wainscot) {
    for (const [x0, x1] of rowIntervals(ctx, bandTop, bandTop + capRail.width)) {
      ctx.pieces.push({ role: 'cap-rail', x: x0, y: bandTop, width: x1 - x0, height: capRail.width });
      // On a stair wall the cap rail follows the rake: its true length is along the nosing line.
      const run = rake ? developed(rake, x1) - developed(rake, x0) : x1 - x0;
      if (rake) ctx.rakeCuts += runRakeCuts(rake, x0, x1);
      addCuts(reg.lengths, capRail.id, trimCuts(run, capRail.length, catalogue.trimEndAllowance));
      capRailFeet += run / 12;
    }
    ctx.caulkFeet += 2 * capRailFeet;
  } else {
    ctx.caulkFeet += length / 12; // along the ceiling
  }
  // Baseboard along the floor, broken by doors; new stock only when it is replaced. On a stair wall it
  // runs only on the level part; the skirt board takes its place along the rake.
  let baseboardFeet = 0;
  const floor: [number, number] = !rake ? [0, length] : rake.stair.startsAt === 'left' ? [rake.span[1], length] : [0, rake.span[0]];
  for (const [x0, x1] of floor[1] - floor[0] < MIN_PIECE ? [] : rowIntervals(ctx, 0, baseboard.width, floor[0], floor[1])) {
    ctx.pieces.push({ role: 'baseboard', x: x0, y: 0, width: x1 - x0, height: baseboard.width });
    if (room.replaceBaseboard) addCuts(reg.lengths, baseboard.id, trimCuts(x1 - x0, baseboard.length, catalogue.trimEndAllowance));
    baseboardFeet += (x1 - x0) / 12;
  }
  if (room.replaceBaseboard) ctx.caulkFeet += baseboardFeet;
  // The skirt board along the rake: bought by stock length, its two ends cut to the stair's angle, its top edge caulked.
  let skirtFeet = 0;
  if (rake && skirt) {
    const run = skirtLength(rake.stair);
    addCuts(reg.lengths, skirt.id, trimCuts(run, skirt.length, catalogue.trimEndAllowance));
    skirtFeet = run / 12;
    ctx.trimFeet += skirtFeet;
    ctx.caulkFeet += skirtFeet;
    ctx.rakeCuts += 2;
  }
  // The edges of openings inside the band (the wall ends are counted per room, by its corners).
  for (const o of blocks) {
    if (!o.inBand) continue;
    const v = overlap(o.sillHeight, o.sillHeight + o.height, bandBottom, levelTop);
    const across = (o.sillHeight > bandBottom ? o.width : 0) + (o.sillHeight + o.height < levelTop ? o.width : 0);
    ctx.caulkFeet += (2 * v + across) / 12;
  }

  if (rake && t.layout === 'balanced' && coversWall(t) && !(t.kind === 'shiplap' && t.orientation === 'horizontal')) {
    notes.push(
      `${label}: along a stair the boards or panels are set out from the foot of the stair, full widths first, rather than balanced between the wall's ends.`,
    );
  }
  if (boards && boards.firstWidth === undefined && boards.lastWidth < 1 && boards.count > 1) {
    notes.push(
      `The last board on ${label} is ripped to ${formatLength(boards.lastWidth, units)}; splitting the difference between the first and last boards looks better (common practice).`,
    );
  }
  if (boards && boards.firstWidth !== undefined && boards.count > 1 && boards.firstWidth < t.minEndWidth - 1e-9) {
    notes.push(
      `${label}: even balanced, the end boards are ${formatLength(boards.firstWidth, units)} wide, narrower than the ${formatLength(t.minEndWidth, units)} the firm accepts; a wider board, or trim at the corners, would hide it.`,
    );
  }
  if (boards && boards.leftover > 0) {
    notes.push(`${label} ends ${formatLength(boards.leftover, units)} short of a full gap; the corner trim hides it.`);
  }
  if (ctx.joints > 0) {
    const moulding = t.kind === 'picture-frame' ? catalogue.mouldings.find((x) => x.id === t.mouldingId) : undefined;
    const longest = moulding ? Math.max(...stockLengthsOf(moulding).map((l) => l.length)) : 0;
    notes.push(
      `Some frame sides on ${label} are longer than the longest moulding (${formatLength(longest, units)}), so they are joined: ${ctx.joints === 1 ? 'one scarf joint' : `${ctx.joints} scarf joints`}.`,
    );
  }
  const backBandFeet = backBandAtCasings(ctx, openings, t, label, units, notes);
  if (rake) notes.push(...stairNotes(label, rake.stair, units));
  const stools = stoolRefitsOnWall(openings, bandBottom, bandTop, t, catalogue, label, units, notes);
  if (boxes.some((b) => b.capRailCrosses)) notes.push(`The cap rail on ${label} would run through an electrical box.`);
  const covered = boxes.filter((b) => b.covered).length;
  // Drawings measure up from the floor at the stair's foot: lift what was laid out in the nosing frame.
  const lift = (x0: number, x1: number): number => (rake ? liftAt(rake, x0, x1) : 0);
  const out: WallTakeoff = {
    label,
    length,
    ceilingHeight: room.ceilingHeight,
    bandBottom,
    bandTop,
    coveredHeight,
    grossSqFt: grossSqIn / 144,
    openingsSqFt: openingsSqIn / 144,
    netSqFt: (grossSqIn - openingsSqIn - fixturesSqIn) / 144,
    openings: rake ? openings.map((o) => ({ ...o, sillHeight: o.sillHeight + lift(o.offset, o.offset + o.width) })) : openings,
    ...(fixtures.length > 0 ? { fixtures, fixturesSqFt: fixturesSqIn / 144 } : {}),
    boxes: rake ? boxes.map((b) => ({ ...b, bottom: b.bottom + lift(b.offset, b.offset + b.width) })) : boxes,
    cutOuts: covered,
    // A return wherever the treatment stops at an opening: in the covered band, or where the cap rail
    // runs into the opening and is returned at its edge (common practice, no source).
    returns: blocks.filter((o) => o.inBand || (wainscot && overlap(o.sillHeight, o.sillHeight + o.height, bandTop, bandTop + capRail.width) > 0)).length,
    ...(boards ? { boards } : {}),
    ...(frames ? { frames } : {}),
    ...(rake ? { rake: rake.g.rake, rakeCuts: ctx.rakeCuts, skirtFeet } : {}),
    pieces: rake ? ctx.pieces.map((p) => ({ ...p, y: p.y + lift(p.x, p.x + p.width) })) : ctx.pieces,
    capRailFeet,
    baseboardFeet,
    notes,
  };
  return {
    wall: out,
    trimFeet: ctx.trimFeet,
    caulkFeet: ctx.caulkFeet,
    backBandFeet,
    rakeCuts: ctx.rakeCuts,
    skirtFeet,
    stoolRefits: stools.length,
    stoolPaintSqIn: stools.paintSqIn,
  };
}

function roomTakeoff(room: Room, catalogue: Catalogue, reg: CutRegistry, paint: boolean, units: Units): RoomTakeoff {
  const { treatment: t, replaced } = treatmentForRoom(room, catalogue);
  const baseboard = catalogue.mouldings.find((m) => m.id === catalogue.baseboardId)!;
  const capRail = catalogue.mouldings.find((m) => m.id === catalogue.capRailId)!;
  let trimFeet = 0;
  let caulkFeet = 0;
  let backBandFeet = 0;
  let rakeCuts = 0;
  let skirtFeet = 0;
  let stoolRefits = 0;
  let stoolPaintSqIn = 0;
  const walls = room.walls.map((w, i) => {
    const wt = wallTakeoff(room, w, i, t, catalogue, reg, units);
    trimFeet += wt.trimFeet;
    caulkFeet += wt.caulkFeet;
    backBandFeet += wt.backBandFeet;
    rakeCuts += wt.rakeCuts;
    skirtFeet += wt.skirtFeet;
    stoolRefits += wt.stoolRefits;
    stoolPaintSqIn += wt.stoolPaintSqIn;
    return wt.wall;
  });
  const sum = (f: (w: WallTakeoff) => number): number => walls.reduce((s, w) => s + f(w), 0);
  const netSqFt = sum((w) => w.netSqFt);
  const capRailFeet = sum((w) => w.capRailFeet);
  const baseboardFeet = sum((w) => w.baseboardFeet);
  // Old baseboard comes off when it is replaced, or when the new work would stand proud of it and it is
  // reset on the new face (removed and installed again, no new stock).
  const baseboardReset = !room.replaceBaseboard && baseboardFeet > 0 && baseboardNeedsReset(t, catalogue);
  const baseboardRemovedFeet = room.replaceBaseboard || baseboardReset ? baseboardFeet : 0;
  if (baseboardReset) caulkFeet += baseboardFeet;
  // A new or reset baseboard is nailed on: its run counts as trim (brads).
  trimFeet += capRailFeet + baseboardRemovedFeet;
  const n = walls.length;
  const insideCorners = room.insideCorners ?? defaultInsideCorners(room.walls);
  const outsideCorners = room.outsideCorners ?? 0;
  // Each corner is one joint where two walls' work meets; every wall end that is not at a corner is
  // a joint of its own: 2n ends, two at each corner.
  const corners = Math.min(n, insideCorners + outsideCorners);
  const bandHeight = walls[0] ? walls[0].coveredHeight : 0;
  caulkFeet += ((2 * n - corners) * bandHeight) / 12;
  // Corner trim the catalogue names: one piece per corner, the band's height (common practice, no source).
  for (const [count, id] of [
    [insideCorners, catalogue.insideCornerTrimId],
    [outsideCorners, catalogue.outsideCornerTrimId],
  ] as const) {
    const trim = id === undefined ? undefined : catalogue.mouldings.find((m) => m.id === id);
    if (!trim || count === 0 || bandHeight <= 0) continue;
    for (let i = 0; i < count; i++) addCuts(reg.lengths, trim.id, trimCuts(bandHeight, trim.length, catalogue.trimEndAllowance));
    trimFeet += (count * bandHeight) / 12;
  }
  const panelSqFt = coversWall(t) ? netSqFt : 0;
  const paintSqFt = paint ? netSqFt + (capRailFeet * capRail.width + (room.replaceBaseboard ? baseboardFeet * baseboard.width : 0)) / 12 : 0;
  return {
    name: room.name,
    treatmentId: t.id,
    treatmentName: t.name,
    treatmentKind: t.kind,
    ...(replaced ? { dampAlternativeFor: replaced.id } : {}),
    height: room.treatment.height,
    ceilingHeight: room.ceilingHeight,
    bandTop: bandTopFor(room),
    walls,
    grossSqFt: sum((w) => w.grossSqFt),
    netSqFt,
    paintSqFt,
    cutOuts: sum((w) => w.cutOuts),
    returns: sum((w) => w.returns),
    insideCorners,
    outsideCorners,
    capRailFeet,
    baseboardFeet,
    baseboardRemovedFeet,
    ...(baseboardReset ? { baseboardReset: true } : {}),
    ...(backBandFeet > 0 ? { backBandFeet } : {}),
    ...(skirtFeet > 0 ? { skirtFeet, rakeCuts } : {}),
    ...(stoolRefits > 0 ? { stoolRefits } : {}),
    // Source: docs/sources.md §5 — 40 CFR 745.83: when painted components are removed, the whole removed area counts.
    // The old baseboard is taken to be as tall as the new one; the old skirt board on a stair wall comes
    // off in full too, and refitted stools and aprons count.
    disturbedPaintSqFt: (baseboardRemovedFeet * baseboard.width + (skirtFeet > 0 ? skirtFeet * skirtStock(catalogue).width : 0)) / 12 + stoolPaintSqIn / 144,
    panelSqFt,
    trimFeet,
    caulkFeet,
    damp: room.damp,
  };
}

/** Takeoff of an already validated project. */
export function takeoffOf(project: Project, catalogue: Catalogue, units: Units): Takeoff {
  const reg: CutRegistry = { sheets: new Map(), lengths: new Map() };
  const rooms = project.rooms.map((r) => roomTakeoff(r, catalogue, reg, project.paint, units));
  const sum = (f: (r: RoomTakeoff) => number): number => rooms.reduce((s, r) => s + f(r), 0);
  const notes: string[] = [];
  if (project.rooms.some((r) => r.treatment.height === 'wainscot' && r.treatment.wainscotHeight === undefined)) {
    notes.push('Where no wainscot height was given, it is one third of the ceiling height, a common design rule.');
  }
  if (rooms.some((r) => r.walls.some((w) => w.openings.some((o) => o.assumed)))) {
    // The same defaults the openings were placed with (geometry.ts), so the note tells what was drawn.
    const len = (x: number): string => formatLength(x, units);
    notes.push(
      `Doors and windows without measurements are drawn at common sizes: doors ${len(DEFAULT_DOOR.width)} × ${len(DEFAULT_DOOR.height)}, windows ${len(DEFAULT_WINDOW.width)} × ${len(DEFAULT_WINDOW.height)} with the sill at ${len(DEFAULT_WINDOW.sillHeight)}, set from the left end of the wall ${len(OPENING_SPACING)} apart, or further where their casings need the room.`,
    );
  }
  const reset = rooms.filter((r) => r.baseboardReset).map((r) => r.name);
  if (reset.length > 0) {
    notes.push(`In ${reset.join(', ')}, the new work would stand proud of the existing baseboard, so the baseboard is taken off and reset on it.`);
  }
  for (const r of rooms) {
    if (r.dampAlternativeFor) {
      const chosen = catalogue.treatments.find((x) => x.id === r.dampAlternativeFor);
      notes.push(
        `${r.name} is a damp room, so it is priced in ${r.treatmentName.toLowerCase()} instead of ${chosen ? chosen.name.toLowerCase() : 'the finish chosen'}.`,
      );
    }
  }
  for (const r of rooms) for (const w of r.walls) notes.push(...w.notes.map((n) => `${r.name}: ${n}`));
  return {
    units,
    rooms,
    grossSqFt: sum((r) => r.grossSqFt),
    netSqFt: sum((r) => r.netSqFt),
    paintSqFt: sum((r) => r.paintSqFt),
    cutOuts: sum((r) => r.cutOuts),
    materials: materialsFor(rooms, reg, catalogue, project.paint, units),
    cautions: cautionsFor(project, rooms, catalogue),
    facts: {
      paint: project.paint,
      builtBefore1978: project.builtBefore1978,
      measuredBy: project.measuredBy,
      photoCount: project.photoCount,
      ...(project.tripZone ? { tripZone: project.tripZone } : {}),
    },
    notes,
  };
}

/**
 * The takeoff of a project against a catalogue: validates the project (throws EstimateInputError
 * with field paths) and its size, then works out every wall and room and the materials list.
 */
export function takeoff(project: unknown, catalogue: Catalogue, units: Units = 'imperial'): Takeoff {
  const p = validateProject(project, catalogue, undefined, units);
  checkProjectSize(p, catalogue);
  return takeoffOf(p, catalogue, units);
}
