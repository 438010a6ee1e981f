import { describe, expect, it } from 'vitest';
import { beadLines, LABEL_SHARE, labelEms, MAX_FRAME_PX, roomFrame, wallFrame, wallPixels, type WallToFrame } from './drawing-layout';

const bath = (length: number): WallToFrame => ({ length, ceilingHeight: 96, leftLabel: `8'`, rightLabel: `3' 4"` });

describe('one scale for every wall of a room', () => {
  it('draws a 5 ft wall 5/8 as wide as an 8 ft wall of the same room', () => {
    // Source: computed here, 60 in / 96 in = 0.625: a drawing to scale keeps the ratio of the lengths.
    const walls = [bath(96), bath(60)];
    const frame = roomFrame(walls);
    const [long, short] = walls.map((w) => wallPixels(wallFrame(w, frame), w, 300));
    expect(short! / long!).toBeCloseTo(0.625, 6);
  });

  it('gives the room’s longest wall the full frame, and the others their share of it', () => {
    const walls = [bath(96), bath(60)];
    const frame = roomFrame(walls);
    expect(wallFrame(walls[0]!, frame).widthShare).toBeCloseTo(1, 9);
    expect(wallFrame(walls[1]!, frame).widthShare).toBeLessThan(1);
    // Every wall of the room gets the same label size on screen: the font is the same share of the frame.
    expect(frame.font / frame.width).toBeCloseTo(LABEL_SHARE, 9);
  });

  it('keeps labels at least 11 px on screen in a 220 px frame (a 320 px phone less the widget’s padding)', () => {
    // Source: the readability target (11 px at 320 px); the widget leaves about 230 px there
    // (measured in tests/e2e/wall-drawing-scale.spec.ts), so 220 px keeps a margin.
    expect(LABEL_SHARE * 220).toBeGreaterThanOrEqual(11);
    // And no more than about 20 px on a desktop, where the frame stops growing.
    expect(LABEL_SHARE * MAX_FRAME_PX).toBeLessThanOrEqual(20);
  });

  it('leaves room beside the wall for the widest height label', () => {
    const walls = [bath(96), { length: 60, ceilingHeight: 96, leftLabel: `8'`, rightLabel: `3' 4-1/2"` }];
    const frame = roomFrame(walls);
    expect(frame.marginRight).toBeGreaterThanOrEqual(labelEms(`3' 4-1/2"`) * frame.font);
    expect(frame.marginLeft).toBeGreaterThanOrEqual(labelEms(`8'`) * frame.font);
    const view = wallFrame(walls[1]!, frame).viewBox;
    expect(view.w).toBeCloseTo(60 + frame.marginLeft + frame.marginRight, 9);
  });

  it('draws a wall with no neighbours at its own scale', () => {
    const w = bath(150);
    const frame = roomFrame([w]);
    expect(wallFrame(w, frame).widthShare).toBeCloseTo(1, 9);
  });
});

describe('beads on beadboard', () => {
  it('puts a bead every spacing from the wall’s left end, inside the piece only', () => {
    // Source: computed here: beads at 0, 2, 4 … in from the wall end, inside a piece from 27.75 to 48 in.
    expect(beadLines({ x: 27.75, width: 20.25 }, 2)).toEqual([28, 30, 32, 34, 36, 38, 40, 42, 44, 46]);
  });
});
