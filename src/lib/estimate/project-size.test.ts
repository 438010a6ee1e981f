import { fc, test as fcTest } from '@fast-check/vitest';
import { describe, expect, it } from 'vitest';
import { checkProjectSize, estimate, parseRateBook, PROJECT_LIMITS, projectSize, sampleRateBook, validateProject, type ProjectInput } from './index.ts';
import { biggestAcceptedProject, costliestAcceptedProject, largeHouse, schemaMaximumProject } from './sample-big-projects.ts';
import { inputRefusal as refusal } from './input-refusal.testing.ts';

const rateBook = parseRateBook(sampleRateBook());
const run = (p: unknown) => estimate(p, rateBook);

// The limits are well above any real home: common practice, no source (see PROJECT_LIMITS).
describe('the size of a project is checked before it is computed', () => {
  it('refuses the biggest project the schema allows, naming the project and each room', () => {
    const e = refusal(() => run(schemaMaximumProject()));
    expect(e.fields.rooms).toMatch(/too big for one online estimate: 320 walls \(at most 120\), 5,120 doors and windows \(at most 400\)/);
    expect(e.fields.rooms).toMatch(/sq ft of covered wall/);
    expect(e.fields.rooms).toMatch(/boards and pieces/);
    for (let r = 0; r < 20; r++) expect(e.fields[`rooms.${r}.walls`]).toMatch(/sq ft; an online estimate takes at most 8,000 sq ft in one room/);
  });

  it('names the one room that is too big', () => {
    const p = largeHouse();
    p.rooms[2] = schemaMaximumProject().rooms[0]!;
    const e = refusal(() => run(p));
    expect(Object.keys(e.fields)).toEqual(['rooms.2.walls', 'rooms']);
    expect(e.fields['rooms.2.walls']).toMatch(/These walls cover about 31,300 sq ft/);
  });

  it('counts the pieces a room would take, and refuses a room of too many', () => {
    // One 100 ft wall under a 10 ft ceiling in 1 in strips: (120 − 5.25) / 1 → 115 rows. Joints on studs
    // 16 in apart and staggered (docs/sources.md §45) make pieces no shorter than max(96 / 2, 96 − 2 × 16)
    // = 64 in before a row's last, so the bound is ceil(1200 / 64) = 19 pieces a row (was 1200 / 96 → 13).
    // Computed here: 6 walls × (115 × 19 + 2) = 6 × 2187 = 13,122.
    const rb = sampleRateBook();
    const t = rb.catalogue.treatments.find((x) => x.id === 'shiplap-vertical-ply')!;
    Object.assign(t, { orientation: 'horizontal', source: { from: 'sheet', sheetId: 'ply-4x8-quarter', stripWidth: 1 }, gap: 0 });
    const parsed = parseRateBook(rb);
    const room = {
      name: 'Hall',
      ceilingHeight: 120,
      walls: Array.from({ length: 6 }, () => ({ length: 1200 })),
      treatment: { id: 'shiplap-vertical-ply', height: 'full' as const },
    };
    const p: ProjectInput = { rooms: [room], builtBefore1978: 'no', measuredBy: 'homeowner-tape' };
    const size = projectSize(validateProject(p, parsed.catalogue), parsed.catalogue);
    expect(size.rooms[0]!.pieces).toBe(6 * (115 * 19 + 2));
    const e = refusal(() => estimate(p, parsed));
    expect(e.fields).toEqual({
      'rooms.0.walls': expect.stringMatching(/would take about 13,122 boards and pieces; an online estimate lays out at most 8,000 in one room/),
    });
  });

  it('accepts an ordinary large house: 8 rooms of 6 walls in every treatment', () => {
    const e = run(largeHouse());
    expect(e.takeoff.rooms.map((r) => r.walls.length)).toEqual([6, 6, 6, 6, 6, 6, 6, 6]);
    expect(e.price.totalCents).toBeGreaterThan(0);
  });

  it('accepts a project just inside the limits', () => {
    const p = validateProject(biggestAcceptedProject(), rateBook.catalogue);
    const size = checkProjectSize(p, rateBook.catalogue);
    expect(size.walls).toBe(PROJECT_LIMITS.walls);
    expect(size.coveredSqFt).toBeGreaterThan(0.9 * PROJECT_LIMITS.coveredSqFt);
    expect(run(biggestAcceptedProject()).takeoff.rooms).toHaveLength(20);
    expect(run(costliestAcceptedProject()).takeoff.rooms).toHaveLength(20);
  });

  it('takes its limits as an option', () => {
    const p = validateProject(largeHouse(), rateBook.catalogue);
    const e = refusal(() => checkProjectSize(p, rateBook.catalogue, { ...PROJECT_LIMITS, walls: 40 }));
    expect(e.fields).toEqual({ rooms: expect.stringMatching(/48 walls \(at most 40\)/) });
  });

  const treatments = ['shiplap-vertical-ply', 'shiplap-horizontal', 'board-and-batten', 'beadboard', 'flat-panel', 'picture-frame'] as const;
  const opening = fc.record({
    kind: fc.constantFrom('door' as const, 'window' as const),
    width: fc.integer({ min: 12, max: 60 }),
    height: fc.integer({ min: 12, max: 60 }),
    sillHeight: fc.integer({ min: 0, max: 30 }),
  });
  const room = fc.record({
    name: fc.constant('Room'),
    // Openings reach at most 30 + 60 in up, under a ceiling of at least 100 in, and a wall is long
    // enough for its openings with their casings and clearances (24 in each is more than the sample
    // rate book asks): every project is valid.
    ceilingHeight: fc.integer({ min: 100, max: 240 }),
    walls: fc.array(
      fc
        .record({ length: fc.integer({ min: 180, max: 600 }), openings: fc.array(opening, { maxLength: 3 }) })
        .filter((wall) => wall.openings.reduce((sum, o) => sum + o.width + 24, 0) <= wall.length),
      { minLength: 1, maxLength: 4 },
    ),
    treatment: fc.record({ id: fc.constantFrom(...treatments), height: fc.constant('full' as const) }),
  });

  // The check must see the work coming: the pieces it counts ahead are never fewer than the takeoff lays.
  fcTest.prop([fc.array(room, { minLength: 1, maxLength: 3 })], { numRuns: 120 })('counts at least the pieces the takeoff lays', (rooms) => {
    const p = validateProject({ rooms, builtBefore1978: 'no', measuredBy: 'homeowner-tape' }, rateBook.catalogue);
    const size = projectSize(p, rateBook.catalogue);
    const e = run(p);
    e.takeoff.rooms.forEach((r, i) => {
      const laid = r.walls.reduce((s, w) => s + w.pieces.length, 0);
      expect(size.rooms[i]!.pieces).toBeGreaterThanOrEqual(laid);
    });
  });
});
