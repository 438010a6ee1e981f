import { renderToStaticMarkup } from 'react-dom/server';
import { createElement } from 'react';
import { describe, expect, it } from 'vitest';
import { WallDrawing } from '~/components/drawing/WallDrawing';
import { estimate, parseRateBook, sampleProject, sampleRateBook, type WallPiece } from '~/lib/estimate';
import { biggestAcceptedProject, largeHouse } from '~/lib/estimate/sample-big-projects';
import { DRAWN_PIECES_BUDGET, drawingPieces, presentForHomeowner } from '~/lib/server/estimates/present-estimate';

const rateBook = parseRateBook(sampleRateBook());
const run = (p: unknown) => estimate(p, rateBook);
const areaByRole = (pieces: WallPiece[]) => {
  const out: Record<string, number> = {};
  for (const p of pieces) out[p.role] = (out[p.role] ?? 0) + p.width * p.height;
  return out;
};

describe("the homeowner's view is sized to what the widget shows", () => {
  it('draws every wall of an ordinary large house, covering the same area with fewer pieces', () => {
    const e = run(largeHouse());
    const view = presentForHomeowner(e);
    e.takeoff.rooms.forEach((room, r) =>
      room.walls.forEach((wall, w) => {
        const shown = view.rooms[r]!.walls[w]!;
        expect(shown.drawn).toBe(true);
        expect(shown.pieces.length).toBeLessThanOrEqual(wall.pieces.length);
        const before = areaByRole(wall.pieces);
        const after = areaByRole(shown.pieces);
        for (const role of Object.keys(before)) expect(after[role]).toBeCloseTo(before[role]!, 1);
      }),
    );
  });

  it('merges boards butted end to end in a course, and keeps the ripped one and the breaks at openings', () => {
    const pieces: WallPiece[] = [
      { role: 'board', x: 0, y: 5.25, width: 96, height: 5.125 },
      { role: 'board', x: 96, y: 5.25, width: 24.000000001, height: 5.125 },
      { role: 'board', x: 150, y: 5.25, width: 30, height: 5.125 },
      { role: 'board', x: 0, y: 10.5, width: 96, height: 2.1, ripped: true },
      { role: 'board', x: 96, y: 10.5, width: 84, height: 2.1, ripped: true },
      { role: 'batten', x: 0, y: 5.25, width: 2.5, height: 30 },
      { role: 'batten', x: 0, y: 35.25, width: 2.5, height: 30 },
    ];
    expect(drawingPieces(pieces)).toEqual([
      // The butt joint between merged boards is kept, so the drawing can show it.
      { role: 'board', x: 0, y: 5.25, width: 120, height: 5.125, joints: [96] },
      { role: 'board', x: 150, y: 5.25, width: 30, height: 5.125 },
      { role: 'board', x: 0, y: 10.5, width: 180, height: 2.1, ripped: true, joints: [96] },
      // Battens are outlined in the drawing, so their joints show and stay.
      { role: 'batten', x: 0, y: 5.25, width: 2.5, height: 30 },
      { role: 'batten', x: 0, y: 35.25, width: 2.5, height: 30 },
    ]);
  });

  it('draws the same wall from the merged pieces', () => {
    const e = run(largeHouse());
    const wall = e.takeoff.rooms[0]!.walls[0]!; // horizontal shiplap, full height
    const shown = presentForHomeowner(e).rooms[0]!.walls[0]!;
    const svg = (w: typeof wall) => renderToStaticMarkup(createElement(WallDrawing, { wall: w, units: 'imperial' }));
    const boardsBefore = wall.pieces.filter((p) => p.role === 'board').length;
    const boardsAfter = shown.pieces.filter((p) => p.role === 'board').length;
    expect(boardsAfter).toBeLessThan(boardsBefore);
    // Everything but the board rectangles and the joint lines is drawn alike.
    const strip = (html: string) => html.replace(/<rect data-role="board"[^>]*><\/rect>/g, '').replace(/<line data-part="joint"[^>]*><\/line>/g, '');
    expect(strip(svg(shown))).toBe(strip(svg(wall)));
    // And every butt joint of the takeoff is drawn: one line per board that does not start a row or follow a gap.
    const joints = shown.pieces.reduce((n, p) => n + (p.joints?.length ?? 0), 0);
    expect(joints).toBe(boardsBefore - boardsAfter);
    expect(svg(shown).match(/data-part="joint"/g)?.length ?? 0).toBe(joints);
  });

  it('staggers the joints of horizontal boards from row to row, as the takeoff lays them', () => {
    // Source: docs/sources.md §45 worked example: a 14 ft (168 in) wall in 8 ft boards, studs 16 in on centre
    // from the left end: row 1 joins at 96 in, row 2 at 80 in, row 3 as row 1.
    const e = run({
      rooms: [{ name: 'Den', ceilingHeight: 96, walls: [{ length: 168 }], treatment: { id: 'shiplap-horizontal', height: 'wainscot', wainscotHeight: 40 } }],
      builtBefore1978: 'no',
      measuredBy: 'homeowner-tape',
    });
    const rows = presentForHomeowner(e)
      .rooms[0]!.walls[0]!.pieces.filter((p) => p.role === 'board' && p.width > 100)
      .sort((a, b) => a.y - b.y)
      .map((p) => p.joints);
    expect(rows.length).toBeGreaterThanOrEqual(3);
    expect(rows.slice(0, 3)).toEqual([[96], [80], [96]]);
  });

  it('keeps a huge project’s answer to a few hundred KB: drawings while the budget lasts, then walls in words', () => {
    const e = run(biggestAcceptedProject());
    const view = presentForHomeowner(e);
    const walls = view.rooms.flatMap((r) => r.walls);
    const drawnPieces = walls.reduce((s, w) => s + w.pieces.length, 0);
    expect(drawnPieces).toBeLessThanOrEqual(DRAWN_PIECES_BUDGET);
    expect(walls[0]!.drawn).toBe(true);
    const words = walls.filter((w) => !w.drawn);
    expect(words.length).toBeGreaterThan(0);
    for (const w of words) expect(w.pieces).toEqual([]);
    // The drawn walls come first, in the order the homeowner listed them.
    expect(walls.findIndex((w) => !w.drawn)).toBe(walls.length - words.length);
    expect(JSON.stringify({ estimate: view }).length).toBeLessThan(450_000);
  });
});

describe("the homeowner's materials list", () => {
  // Demo rate book: the sample project's paint is bought as a mix of containers (containers.ts);
  // the homeowner reads the mix, not a bare "1 set".
  it('names the containers paint and primer are bought in', () => {
    const e = run({ ...sampleProject(), paint: true });
    const paint = e.takeoff.materials.find((m) => m.id === 'paint')!;
    const shown = presentForHomeowner(e).materials.find((m) => m.label.startsWith(paint.label))!;
    expect(paint.packs!.length).toBeGreaterThan(0);
    expect(shown.label).toMatch(/^Interior trim enamel, eggshell: \d+ (quart|gallon|5-gallon pail)/);
    expect(shown).toMatchObject({ quantity: 1, unit: 'set' });
  });
});
