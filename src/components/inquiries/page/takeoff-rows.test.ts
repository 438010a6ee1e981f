import { describe, expect, test } from 'vitest';
import { estimate, sampleProject, sampleRateBook } from '~/lib/estimate';
import { takeoffRows, wallRow } from './takeoff-rows';

const { takeoff } = estimate(sampleProject(), sampleRateBook());

describe('the takeoff by room and wall', () => {
  test('counts what the homeowner put on each wall', () => {
    // The sample dining room: a window on the window wall, a door on the hall and kitchen walls,
    // 2 + 1 + 2 + 1 outlets and one switch (sample-data.ts, the project these rows are read from).
    const dining = takeoffRows(takeoff.rooms).rooms[0]!;
    expect(dining.walls.map((w) => [w.label, w.doors, w.windows, w.boxes])).toEqual([
      ['Window wall', 0, 1, 2],
      ['Hall wall', 1, 0, 2],
      ['Sideboard wall', 0, 0, 2],
      ['Kitchen wall', 1, 0, 1],
    ]);
    expect(dining.total).toMatchObject({ doors: 2, windows: 1, boxes: 7 });
  });

  test('room and job totals are the sums of their walls and agree with the core’s own totals', () => {
    const { rooms, total } = takeoffRows(takeoff.rooms);
    // common practice, no source: a takeoff's subtotal is the sum of its lines.
    for (const [i, room] of rooms.entries()) {
      expect(room.total.netSqFt).toBeCloseTo(takeoff.rooms[i]!.netSqFt, 6);
      expect(room.total.capRailFeet).toBeCloseTo(takeoff.rooms[i]!.capRailFeet, 6);
      expect(room.total.cutOuts).toBe(takeoff.rooms[i]!.cutOuts);
    }
    expect(total.netSqFt).toBeCloseTo(takeoff.netSqFt, 6);
    expect(total.cutOuts).toBe(takeoff.cutOuts);
    expect(total.insideCorners).toBe(takeoff.rooms.reduce((n, r) => n + r.insideCorners, 0));
  });

  test('board-and-batten walls count battens as trim pieces; a vertical shiplap wall counts its boards', () => {
    const dining = takeoff.rooms[0]!;
    const bedroom = takeoff.rooms[1]!;
    const diningWall = wallRow(dining.walls[0]!);
    expect(diningWall.trimPieces).toBe(dining.walls[0]!.pieces.filter((p) => ['batten', 'stile', 'rail'].includes(p.role)).length);
    expect(diningWall.trimPieces).toBeGreaterThan(0);
    const bedWall = wallRow(bedroom.walls[0]!);
    expect(bedWall.boards + bedWall.sheets).toBeGreaterThan(0);
    // A 150" wall: a board layout's count covers its length (from memory: boards × face width ≥ run).
    const layout = bedroom.walls[0]!.boards;
    if (layout) expect(layout.count * (layout.boardWidth + layout.gap)).toBeGreaterThanOrEqual(150 - layout.boardWidth);
  });
});
