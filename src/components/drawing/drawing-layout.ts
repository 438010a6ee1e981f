/**
 * Where a wall drawing's parts go, as plain numbers (no React): the frame every wall of a room shares
 * so they are drawn to one scale, room beside each wall for its height labels, and the beads on
 * beadboard. Lengths are inches; on-screen sizes are CSS pixels.
 */

/**
 * Label font size as a share of the room's frame width. Every wall of a room is drawn as a share of
 * the same frame, so its labels come out the same size on screen: 0.052 × 220 px ≈ 11.4 px. The
 * widget leaves a frame of about 230 px on a 320 px phone (measured by tests/e2e/wall-drawing-scale.spec.ts).
 */
export const LABEL_SHARE = 0.052;

/** The frame stops growing at this width on wide screens, so labels stay under 20 px there. */
export const MAX_FRAME_PX = 380;

/** Space between the wall and its dimension line, and between that line and its label, in ems. */
const DIMENSION_GAP_EMS = 1.2;
const LABEL_GAP_EMS = 0.5;
/** White space outside a side label, so a face a little wider than estimated is not clipped. */
const EDGE_EMS = 0.4;
/** Above the wall: a one-line note such as the ripped last board. */
const TOP_EMS = 1.5;
/** Below the wall: the length's dimension line and its label. */
const BOTTOM_EMS = 2.8;
/** The wall never gets less than this share of its frame, however long the labels. */
const MIN_WALL_SHARE = 0.35;

/**
 * Approximate width of a label in ems for a sans-serif face with tabular figures: digits and letters
 * about 0.6 em, spaces, quote marks and dots narrower (common practice, no source). Over-estimating
 * only leaves a little more white space.
 */
export function labelEms(label: string): number {
  let ems = 0;
  for (const ch of label) ems += /[\s'".,]/.test(ch) ? 0.3 : /[-/]/.test(ch) ? 0.4 : 0.62;
  return ems;
}

export interface WallToFrame {
  length: number;
  ceilingHeight: number;
  /** The label left of the wall (its ceiling height) and right of it (the top of the wainscot), if any. */
  leftLabel: string;
  rightLabel?: string;
}

export interface RoomFrame {
  /** Width in inches of the longest wall with its margins: the whole frame. */
  width: number;
  /** Label font size in inches. */
  font: number;
  marginLeft: number;
  marginRight: number;
  marginTop: number;
  marginBottom: number;
}

/** The frame shared by every wall of one room, sized for its longest wall and its widest labels. */
export function roomFrame(walls: readonly WallToFrame[]): RoomFrame {
  const longest = Math.max(...walls.map((w) => w.length));
  const side = (label: string | undefined): number => (label ? DIMENSION_GAP_EMS + LABEL_GAP_EMS + labelEms(label) + EDGE_EMS : DIMENSION_GAP_EMS + EDGE_EMS);
  const leftEms = Math.max(...walls.map((w) => side(w.leftLabel)));
  const rightEms = Math.max(...walls.map((w) => side(w.rightLabel)));
  // width = longest + (leftEms + rightEms) × font, with font = LABEL_SHARE × width.
  const wallShare = Math.max(MIN_WALL_SHARE, 1 - LABEL_SHARE * (leftEms + rightEms));
  const width = longest / wallShare;
  // LABEL_SHARE × width, unless the labels are so long that the wall's share was held at its minimum.
  const font = (width * (1 - wallShare)) / (leftEms + rightEms);
  return {
    width,
    font,
    marginLeft: leftEms * font,
    marginRight: rightEms * font,
    marginTop: TOP_EMS * font,
    marginBottom: BOTTOM_EMS * font,
  };
}

export interface WallFrame {
  /** The SVG viewBox in inches: x and y of its top left corner (the wall's top left is 0, 0). */
  viewBox: { x: number; y: number; w: number; h: number };
  /** The drawing's width as a share of the room's frame (1 for the longest wall). */
  widthShare: number;
}

/** One wall's viewBox inside its room's frame: the room's margins around this wall's own size. */
export function wallFrame(wall: WallToFrame, frame: RoomFrame): WallFrame {
  const w = wall.length + frame.marginLeft + frame.marginRight;
  return {
    viewBox: { x: -frame.marginLeft, y: -frame.marginTop, w, h: wall.ceilingHeight + frame.marginTop + frame.marginBottom },
    widthShare: w / frame.width,
  };
}

/** How many CSS pixels the wall itself (without margins) takes when the room's frame is `framePx` wide. */
export function wallPixels(view: WallFrame, wall: WallToFrame, framePx: number): number {
  return (framePx * view.widthShare * wall.length) / view.viewBox.w;
}

/**
 * Where beads fall on a beadboard piece: every `spacing` inches from the wall's left end, so beads on
 * pieces cut around a door line up as on the sheet, and strictly inside the piece (its edges are seams).
 */
export function beadLines(piece: { x: number; width: number }, spacing: number): number[] {
  const out: number[] = [];
  const end = piece.x + piece.width - 1e-6;
  for (let x = Math.floor(piece.x / spacing + 1 - 1e-9) * spacing; x < end; x += spacing) {
    if (x > piece.x + 1e-6) out.push(Math.round(x * 1000) / 1000);
  }
  return out;
}

/** What the drawing's side labels say: the ceiling height left, the top of a wainscot (from the floor, as typed) right. */
export function wallToFrame(
  wall: { length: number; ceilingHeight: number; bandTop: number; bandBottom: number; rake?: unknown },
  format: (inches: number) => string,
): WallToFrame {
  const wainscot = wall.bandTop < wall.ceilingHeight - 1e-6;
  // On a stair wall the band follows the nosing line, so its height is measured from there, not the floor.
  const right = wall.rake ? format(wall.bandTop - wall.bandBottom) : wainscot ? format(wall.bandTop) : undefined;
  return { length: wall.length, ceilingHeight: wall.ceilingHeight, leftLabel: format(wall.ceilingHeight), ...(right ? { rightLabel: right } : {}) };
}
