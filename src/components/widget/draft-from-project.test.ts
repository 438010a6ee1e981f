import { describe, expect, it } from 'vitest';
import { estimate, sampleRateBook, type ProjectInput } from '~/lib/estimate/index.ts';
import { newDraft, newRoom, toProject, type Draft } from './draft';
import { draftFromProject } from './draft-from-project';

// A living room in room mode with an accent wall in another finish, and a bathroom typed wall by
// wall with its own finish, a tub and a door: every kind of choice the form can make.
function fullDraft(): Draft {
  const living = { ...newRoom('imperial', 'Living room'), length: "17'", width: "14'", ceilingHeight: "8'", placement: 'by-wall' as const };
  living.roomWalls = [
    { ...living.roomWalls[0], windows: 2, outlets: 3 },
    { ...living.roomWalls[1], doors: 1, switches: 1 },
    { ...living.roomWalls[2], outlets: 2 },
    { ...living.roomWalls[3], covered: false },
  ];
  living.accent = { wall: 2, finish: { treatmentId: 'shiplap-vertical-ply', height: 'full', wainscotHeight: '' } };
  const bath = {
    ...newRoom('imperial', 'Bathroom'),
    mode: 'walls' as const,
    ceilingHeight: "8'",
    placement: 'by-wall' as const,
    damp: true,
    hasFixtures: true,
    finish: { treatmentId: 'beadboard', height: 'wainscot' as const, wainscotHeight: '48"' },
  };
  bath.walls = [
    { ...bath.walls[0]!, length: "8'", fixtures: ['tub'] },
    { ...bath.walls[0]!, key: 'k-bath-2', length: '5\' 6"', doors: 1 },
  ];
  return {
    ...newDraft('imperial'),
    rooms: [living, bath],
    treatmentId: 'board-and-batten',
    wainscotHeight: '36"',
    replaceBaseboard: true,
    paint: false,
    builtBefore1978: 'no',
    measuredBy: 'homeowner-tape',
  };
}

describe('draftFromProject', () => {
  it('opens a project the form made as a draft that makes the same project again', () => {
    const { project, errors } = toProject(fullDraft(), 'imperial');
    expect(errors).toEqual({});
    const again = toProject(draftFromProject(project!, 'imperial'), 'imperial');
    expect(again.errors).toEqual({});
    expect(again.project).toEqual(project);
  });

  it('puts the accent wall back on its room and keeps the walls not covered', () => {
    const draft = draftFromProject(toProject(fullDraft(), 'imperial').project!, 'imperial');
    const living = draft.rooms[0]!;
    expect(draft.rooms.map((r) => r.name)).toEqual(['Living room', 'Bathroom']);
    expect(living.accent).toEqual({ wall: 2, finish: { treatmentId: 'shiplap-vertical-ply', height: 'full', wainscotHeight: '' } });
    expect(living.roomWalls.map((w) => w.covered)).toEqual([true, true, true, false]);
    expect(draft.rooms[1]!.finish).toEqual({ treatmentId: 'beadboard', height: 'wainscot', wainscotHeight: "4'" });
  });

  it('opens rooms given by side without wall names (as older inquiries were stored) at the same price', () => {
    const project: ProjectInput = {
      rooms: [
        {
          name: 'Dining room',
          ceilingHeight: 96,
          length: 156,
          width: 132,
          walls: [
            { side: 'length', openings: [{ kind: 'window' }], outlets: 2 },
            { side: 'width', openings: [{ kind: 'door' }], outlets: 1, switches: 1 },
          ],
          treatment: { id: 'board-and-batten', height: 'wainscot', wainscotHeight: 36 },
          replaceBaseboard: true,
          damp: false,
        },
      ],
      paint: true,
      builtBefore1978: 'not-sure',
      measuredBy: 'homeowner-estimate',
      photoCount: 0,
    };
    const again = toProject(draftFromProject(project, 'imperial'), 'imperial').project!;
    expect(again.rooms[0]!.walls.map((w) => [w.side, w.label])).toEqual([
      ['length', 'Long wall 1'],
      ['width', 'Short wall 1'],
    ]);
    // The same rooms, so the estimating core prices them the same.
    expect(estimate(again, sampleRateBook()).price.totalCents).toBe(estimate(project, sampleRateBook()).price.totalCents);
  });

  it('keeps metric lengths to the millimetre', () => {
    const project: ProjectInput = {
      rooms: [{ name: 'Hall', ceilingHeight: 2400 / 25.4, walls: [{ length: 3450 / 25.4 }], treatment: { id: 'beadboard', height: 'full' } }],
      builtBefore1978: 'no',
      measuredBy: 'homeowner-tape',
    };
    const draft = draftFromProject(project, 'metric');
    expect([draft.rooms[0]!.ceilingHeight, draft.rooms[0]!.walls[0]!.length]).toEqual(['2400 mm', '3450 mm']);
  });
});
