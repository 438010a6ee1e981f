import { apportionToStep } from '~/lib/estimate/money';
import { describePacks, type Estimate, type WallPiece, type WallTakeoff } from '~/lib/estimate';
import type { DrawnPiece, HomeownerEstimate, HomeownerWall } from '~/lib/shared/homeowner-estimate';
import { rangeReason } from './range-reason';

export type { HomeownerEstimate };

/**
 * Pieces drawn in one answer, every wall together: an ordinary large house (8 rooms of 6 walls in
 * every treatment) takes about 1,100 once butted boards are merged, and 4,000 pieces are about 250 KB
 * of JSON (common practice, no source). Walls past the budget are described in words instead.
 */
export const DRAWN_PIECES_BUDGET = 4000;

const r3 = (x: number): number => Math.round(x * 1000) / 1000;

/**
 * The pieces a drawing needs: boards and strips butted end to end in one course are drawn without
 * an outline (WallDrawing), so they become one rectangle that keeps where they met (`joints`, drawn
 * as lines, staggered as the takeoff staggers them); coordinates to a thousandth of an inch, the
 * precision the drawing uses.
 */
export function drawingPieces(pieces: WallPiece[]): DrawnPiece[] {
  const out: DrawnPiece[] = [];
  for (const p of pieces) {
    const last = out.at(-1);
    const butted =
      last !== undefined &&
      (p.role === 'board' || p.role === 'strip') &&
      last.role === p.role &&
      (last.ripped ?? false) === (p.ripped ?? false) &&
      Math.abs(last.y - p.y) < 1e-6 &&
      Math.abs(last.height - p.height) < 1e-6 &&
      Math.abs(last.x + last.width - p.x) < 1e-6;
    if (butted) {
      (last.joints ??= []).push(r3(p.x));
      last.width = r3(last.width + p.width);
    } else out.push({ ...p, x: r3(p.x), y: r3(p.y), width: r3(p.width), height: r3(p.height), ...(p.ripped ? { ripped: true } : {}) });
  }
  for (const p of out) if (!p.ripped) delete p.ripped;
  return out;
}

/** Each wall with its drawing while the budget (pieces and joints) lasts; the rest with no pieces and `drawn: false`. */
function wallsForDrawing(rooms: Estimate['takeoff']['rooms'], budget: number): HomeownerWall[][] {
  let left = budget;
  return rooms.map((room) =>
    room.walls.map((wall: WallTakeoff): HomeownerWall => {
      const pieces = drawingPieces(wall.pieces);
      // A kept joint costs about as much JSON as a piece, so it counts against the budget as one.
      const cost = pieces.reduce((n, p) => n + 1 + (p.joints?.length ?? 0), 0);
      const drawn = cost <= left;
      if (drawn) left -= cost;
      return { ...wall, pieces: drawn ? pieces : [], drawn };
    }),
  );
}

/** What a homeowner sees of an estimate: the firm's unit rates stay on the server. */
export function presentForHomeowner(result: Estimate, drawnPiecesBudget = DRAWN_PIECES_BUDGET): HomeownerEstimate {
  const { takeoff, price } = result;
  const walls = wallsForDrawing(takeoff.rooms, drawnPiecesBudget);
  const raw: HomeownerEstimate['groups'] = [
    { id: 'materials', label: 'Materials and supplies', cents: price.materialsCents + price.markupCents },
    { id: 'labour', label: `Installation${takeoff.facts.paint ? ' and painting' : ''}`, cents: price.labourCents },
    { id: 'extras', label: 'Set-up and extras', cents: price.extrasCents },
    { id: 'tax', label: 'Tax', cents: price.taxCents },
    // Under the firm's minimum the difference is its own line, so the groups add up to the middle of the range.
    { id: 'minimum', label: 'Minimum job', cents: price.totalCents - price.subtotalCents },
  ];
  const { groups, middleCents } = roundedGroups(raw, price.roundingCents ?? OLD_SNAPSHOT_STEP_CENTS);
  return {
    units: takeoff.units,
    currency: price.currency,
    locale: price.locale,
    range: { lowCents: price.lowCents, highCents: price.highCents, text: price.rangeText },
    rangeReason: rangeReason(takeoff.facts.measuredBy, takeoff.facts.photoCount, price.spread),
    minimumApplied: price.minimumApplied,
    middleCents,
    groups,
    extras: price.lines.filter((l) => l.group === 'extras').map((l) => l.label),
    rooms: takeoff.rooms.map((room, r) => ({
      name: room.name,
      treatmentName: room.treatmentName,
      treatmentKind: room.treatmentKind,
      height: room.height,
      netSqFt: room.netSqFt,
      walls: walls[r]!,
    })),
    // Paint bought as a mix of containers reads as the mix ("1 gallon + 2 quarts"), not "1 set".
    materials: takeoff.materials.map((m) =>
      m.packs && m.packs.length > 0
        ? { label: `${m.label}: ${describePacks(m.packs)}`, quantity: 1, unit: 'set' }
        : { label: m.label, quantity: m.quantity, unit: m.unit },
    ),
    cautions: takeoff.cautions,
    notes: takeoff.notes,
  };
}

/** Snapshots stored before the price kept its rounding step are shown to the whole currency unit. */
const OLD_SNAPSHOT_STEP_CENTS = 100;

/**
 * The groups rounded the way the range is rounded, adding up exactly to the rounded middle
 * (largest remainder, docs/sources.md §53). A group that rounds to nothing is left out rather than
 * shown as "about $0"; its share is carried by the others.
 */
function roundedGroups(raw: HomeownerEstimate['groups'], step: number): { groups: HomeownerEstimate['groups']; middleCents: number } {
  const { parts, totalCents } = apportionToStep(
    raw.map((g) => g.cents),
    step,
  );
  return { groups: raw.map((g, i) => ({ ...g, cents: parts[i]! })).filter((g) => g.cents > 0), middleCents: totalCents };
}
