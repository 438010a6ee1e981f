/**
 * Build-up at casings: how far the new work stands out from the old wall, and whether it comes proud
 * of the existing casing so that a back band (a moulding around the casing's outside edge) is needed.
 */
import type { Catalogue, Treatment } from './schemas.ts';
import type { PlacedOpening } from './types.ts';

// The new face should stay at least 1/8 in behind the casing's face, so the casing still reads as
// the frame of the opening and its edge is not buried: common practice, no source. docs/sources.md §31.
export const CASING_REVEAL = 0.125;

/** Thickness of the new work on the wall at a casing: backing sheet plus battens or stiles, or the boards or sheet. */
export function newFaceThickness(t: Treatment, c: Catalogue): number {
  const sheet = (id: string | undefined): number => (id === undefined ? 0 : (c.sheets.find((s) => s.id === id)?.thickness ?? 0));
  const board = (id: string): number => c.boards.find((b) => b.id === id)?.thickness ?? 0;
  switch (t.kind) {
    case 'shiplap':
      return t.source.from === 'sheet' ? sheet(t.source.sheetId) : board(t.source.boardId);
    case 'beadboard':
      return sheet(t.sheetId);
    case 'board-and-batten':
      return sheet(t.backingSheetId) + board(t.battenId);
    case 'flat-panel':
      return sheet(t.backingSheetId) + board(t.stileId);
    case 'picture-frame':
      return c.mouldings.find((m) => m.id === t.mouldingId)?.thickness ?? 0;
  }
}

/** How far the new face stands out past the point CASING_REVEAL behind the casing's face (0 when it does not). */
export function proudOfCasing(faceThickness: number, casingThickness: number): number {
  return Math.max(0, faceThickness - (casingThickness - CASING_REVEAL));
}

/**
 * The back band around one opening's casing, as runs to cut: two sides from the floor or sill to the
 * top of the head casing, and the head across both casings (sides + head, like the casing itself).
 */
export function backBandRuns(o: PlacedOpening): number[] {
  const c = o.casingWidth ?? 0;
  if (c <= 0) return [];
  return [o.height + c, o.height + c, o.width + 2 * c];
}

/**
 * Whether the new work stands proud of the existing baseboard's face (less CASING_REVEAL): then the
 * baseboard comes off, the work goes down to the floor line, and the baseboard is reset on its face
 * (common practice, no source; docs/sources.md §31). Picture frames stand clear of the baseboard.
 */
export function baseboardNeedsReset(t: Treatment, c: Catalogue): boolean {
  if (t.kind === 'picture-frame') return false;
  return newFaceThickness(t, c) > c.existingBaseboardThickness - CASING_REVEAL + 1e-9;
}
