import { describe, expect, it } from 'vitest';
import {
  BUILT_BEFORE_1978_REQUIRED,
  fieldStep,
  isDamp,
  newDraft,
  newRoom,
  normaliseServerErrors,
  placeForMe,
  toProject,
  unansweredQuestions,
  draftWaitingContext,
  type Draft,
} from './draft';
import { fitProblem } from './wall-fit';
import { waitingFor } from './waiting-for';
import { estimate, sampleRateBook } from '~/lib/estimate/index.ts';

describe('the "built before 1978" question', () => {
  it('starts unanswered and must be answered before going on', () => {
    const draft = newDraft('imperial');
    expect(draft.builtBefore1978).toBeNull();
    expect(unansweredQuestions(draft)).toEqual({ 'project.builtBefore1978': BUILT_BEFORE_1978_REQUIRED });
    expect(unansweredQuestions({ ...draft, builtBefore1978: 'no' })).toEqual({});
  });

  it('is priced as "not sure" until answered, so the live range never leaves out lead-safe work', () => {
    const draft = bathroom();
    expect(toProject(draft, 'imperial').project?.builtBefore1978).toBe('not-sure');
    expect(toProject({ ...draft, builtBefore1978: 'no' }, 'imperial').project?.builtBefore1978).toBe('no');
  });
});

// A 5 × 8 ft bathroom: tub on a long wall, door on a short wall, window on the other long wall.
function bathroom(): Draft {
  const draft = { ...newDraft('imperial'), treatmentId: 'beadboard', wainscotHeight: '48"' };
  const room = { ...newRoom('imperial', 'Bathroom'), length: "8'", width: "5'", ceilingHeight: "8'", placement: 'by-wall' as const };
  room.roomWalls = [
    { ...room.roomWalls[0], fixtures: ['tub'] },
    { ...room.roomWalls[1], doors: 1 },
    { ...room.roomWalls[2], windows: 1, outlets: 1 },
    { ...room.roomWalls[3] },
  ];
  return { ...draft, rooms: [room] };
}

describe('rooms start empty', () => {
  it('has no sizes or counts filled in, so nothing looks like an answer the homeowner gave', () => {
    const room = newDraft('imperial').rooms[0]!;
    expect([room.name, room.length, room.width, room.ceilingHeight, newDraft('imperial').wainscotHeight]).toEqual(['', '', '', '', '']);
    expect(room.counts).toEqual({ doors: 0, windows: 0, outlets: 0, switches: 0, fixtures: [] });
    expect(toProject({ ...newDraft('imperial'), treatmentId: 'shiplap' }, 'imperial').errors).toMatchObject({
      'project.rooms.0.length': 'Room length is required.',
      'project.rooms.0.ceilingHeight': 'Ceiling height is required.',
    });
  });
});

describe('toProject, wall by wall', () => {
  it('puts each door, window and fixture on the wall the homeowner chose', () => {
    const { project, errors } = toProject(bathroom(), 'imperial');
    expect(errors).toEqual({});
    // Source: src/lib/shared/wall-names.ts — walls go clockwise from a wall along the room's length.
    expect(project!.rooms[0]!.walls).toEqual([
      expect.objectContaining({ side: 'length', label: 'Long wall 1', openings: [], fixtures: [{ kind: 'tub' }] }),
      expect.objectContaining({ side: 'width', label: 'Short wall 1', openings: [{ kind: 'door', count: 1 }] }),
      expect.objectContaining({ side: 'length', label: 'Long wall 2', openings: [{ kind: 'window', count: 1 }], outlets: 1 }),
      expect.objectContaining({ side: 'width', label: 'Short wall 2', openings: [] }),
    ]);
  });

  it('leaves out walls not covered and keeps the draft wall numbers in origin', () => {
    const draft = bathroom();
    draft.rooms[0]!.roomWalls[0] = { ...draft.rooms[0]!.roomWalls[0], covered: false };
    const { project, origin } = toProject(draft, 'imperial');
    expect(project!.rooms[0]!.walls!.map((w) => w.label)).toEqual(['Short wall 1', 'Long wall 2', 'Short wall 2']);
    expect(origin).toEqual([{ room: 0, accent: false, walls: [1, 2, 3] }]);
  });

  it('gives a listed wall its own items in "wall by wall" mode', () => {
    const room = { ...newRoom('imperial', 'Hall'), mode: 'walls' as const, ceilingHeight: "8'", placement: 'by-wall' as const };
    room.walls = [
      { ...room.walls[0]!, length: "10'", doors: 2 },
      { ...room.walls[0]!, key: 'w2', length: "4'", windows: 1 },
    ];
    const { project } = toProject({ ...newDraft('imperial'), treatmentId: 'shiplap', wainscotHeight: '36"', rooms: [room] }, 'imperial');
    expect(project!.rooms[0]!.walls).toEqual([
      expect.objectContaining({ length: 120, label: 'Wall 1', openings: [{ kind: 'door', count: 2 }] }),
      expect.objectContaining({ length: 48, label: 'Wall 2', openings: [{ kind: 'window', count: 1 }] }),
    ]);
  });
});

describe('the fit rule', () => {
  // Source: docs/sources.md §30 (openings a homeowner counted stand 3 in from the wall ends and
  // clear of their neighbours' casings; a stock casing is 2-1/4 in) and src/lib/estimate/geometry.ts
  // (a counted door or window is taken as 36 in wide, the 3'0" door of docs/sources.md §7).
  it('says, next to the wall, that a door and a window are wider than a 4 ft wall, in feet and inches', () => {
    const draft = bathroom();
    draft.rooms[0]!.width = "4'";
    draft.rooms[0]!.roomWalls[1] = { ...draft.rooms[0]!.roomWalls[1], doors: 1, windows: 1 };
    expect(toProject(draft, 'imperial').errors).toEqual({
      'project.rooms.0.walls.1.openings':
        "The door and window add up to 6' 0\", more than this 4' 0\" wall. Move one of them to another wall, or check the wall's length.",
    });
  });

  it('refuses a 36 in door on a 41 in wall (it needs 3 in each side) and accepts it on 42 in', () => {
    // 3 + 36 + 3 = 42 in; the casing (2-1/4 in) is narrower than the 3 in spacing.
    expect(fitProblem({ doors: 1, windows: 0, fixtures: [] }, 41, 'imperial')).toMatch(
      /^The door needs a little room beside it for the trim, more than this 3' 5" wall has/,
    );
    expect(fitProblem({ doors: 1, windows: 0, fixtures: [] }, 42, 'imperial')).toBeNull();
  });

  it('speaks millimetres for a metric firm', () => {
    expect(fitProblem({ doors: 1, windows: 1, fixtures: [] }, 1200 / 25.4, 'metric')).toMatch(/add up to 1829 mm, more than this 1200 mm wall/);
  });

  it('counts a fixture: a 60 in tub does not fit on a 5 ft wall beside a door', () => {
    // Source: docs/sources.md §20 — a standard alcove tub is 60 in long.
    expect(fitProblem({ doors: 1, windows: 0, fixtures: ['tub'] }, 60, 'imperial')).toMatch(/^The door and tub add up to 8' 0", more than this 5' 0" wall/);
  });
});

describe('"Place them for me"', () => {
  it('puts a door on the longest covered wall it fits on and says where', () => {
    const room = {
      ...newRoom('imperial', 'Bathroom'),
      length: "8'",
      width: "5'",
      ceilingHeight: "8'",
      counts: { doors: 1, windows: 1, outlets: 2, switches: 1, fixtures: ['tub' as const] },
    };
    const placed = placeForMe(room, 'imperial');
    expect(placed.unplaced).toEqual([]);
    // Door first on Long wall 1 (96 in: 3 + 36 + 3 = 42 in used); the tub (60 in) no longer fits
    // there beside it (42 + 60 > 96), so it goes on Long wall 2; the window joins the door.
    expect(placed.notes).toEqual(['Long wall 1: 1 door, 1 window', 'Long wall 2: tub']);
  });

  it('says what fits nowhere', () => {
    const room = {
      ...newRoom('imperial', 'Closet'),
      length: "3'",
      width: "3'",
      ceilingHeight: "8'",
      counts: { doors: 1, windows: 0, outlets: 0, switches: 0, fixtures: [] },
    };
    expect(placeForMe(room, 'imperial').unplaced).toEqual(['a door']);
    expect(
      toProject({ ...newDraft('imperial'), treatmentId: 'shiplap', wainscotHeight: '36"', rooms: [room] }, 'imperial').errors['project.rooms.0.placement'],
    ).toMatch(/room for a door/);
  });
});

describe('damp rooms', () => {
  // Source: docs/sources.md §10 — bathrooms and showers are the damp rooms; laundries and utility
  // rooms by common practice, no source.
  it.each(['Bathroom', 'Kids bath', 'Laundry', 'Washroom', 'Shower room', 'Utility room', 'Downstairs WC'])('proposes %s as damp', (name) => {
    expect(isDamp({ ...newRoom('imperial'), name })).toBe(true);
  });
  it.each(['Living room', 'Bedroom', 'Hallway', 'Bathurst study'])('does not propose %s', (name) => {
    expect(isDamp({ ...newRoom('imperial'), name })).toBe(false);
  });
  it('lets the homeowner untick the proposal', () => {
    expect(isDamp({ ...newRoom('imperial'), name: 'Bathroom', damp: false })).toBe(false);
    expect(toProject({ ...bathroom(), rooms: [{ ...bathroom().rooms[0]!, damp: false }] }, 'imperial').project!.rooms[0]!.damp).toBe(false);
    expect(toProject(bathroom(), 'imperial').project!.rooms[0]!.damp).toBe(true);
  });
});

describe('a finish per room and one accent wall', () => {
  function living(): Draft {
    const draft = bathroom();
    const room = { ...newRoom('imperial', 'Living room'), length: "14'", width: "12'", ceilingHeight: "8'", placement: 'by-wall' as const };
    return { ...draft, rooms: [...draft.rooms, room] };
  }

  it("uses the first room's finish for the next room until it chooses its own", () => {
    const draft = living();
    expect(toProject(draft, 'imperial').project!.rooms[1]!.treatment).toEqual({ id: 'beadboard', height: 'wainscot', wainscotHeight: 48 });
    draft.rooms[1] = { ...draft.rooms[1]!, finish: { treatmentId: 'shiplap', height: 'full', wainscotHeight: '' } };
    expect(toProject(draft, 'imperial').project!.rooms[1]!.treatment).toEqual({ id: 'shiplap', height: 'full' });
  });

  it('sends the accent wall as a room of its own that the main room does not cover', () => {
    const draft = living();
    draft.rooms[1] = { ...draft.rooms[1]!, accent: { wall: 2, finish: { treatmentId: 'board-and-batten', height: 'full', wainscotHeight: '' } } };
    const { project, origin } = toProject(draft, 'imperial');
    expect(project!.rooms.map((r) => r.name)).toEqual(['Bathroom', 'Living room', 'Living room — accent wall']);
    expect(project!.rooms[1]!.walls!.map((w) => w.label)).toEqual(['Long wall 1', 'Short wall 1', 'Short wall 2']);
    expect(project!.rooms[2]).toMatchObject({
      length: 168,
      width: 144,
      walls: [{ side: 'length', label: 'Long wall 2' }],
      treatment: { id: 'board-and-batten', height: 'full' },
    });
    // Source: docs/sources.md §21 — four walls closing a room meet at four inside corners; the
    // main room keeps all four, the accent wall's room none, so the corner trim is not lost.
    expect([project!.rooms[1]!.insideCorners, project!.rooms[2]!.insideCorners]).toEqual([4, 0]);
    expect(origin).toEqual([
      { room: 0, accent: false, walls: [0, 1, 2, 3] },
      { room: 1, accent: false, walls: [0, 1, 3] },
      { room: 1, accent: true, walls: [2] },
    ]);
  });

  it('asks which wall until one is chosen', () => {
    const draft = living();
    draft.rooms[1] = { ...draft.rooms[1]!, accent: { wall: null, finish: { treatmentId: 'shiplap', height: 'full', wainscotHeight: '' } } };
    expect(toProject(draft, 'imperial').errors).toEqual({ 'project.rooms.1.accent.wall': 'Choose the accent wall (one of the walls to cover).' });
    expect(fieldStep('project.rooms.1.accent.wall')).toBe('treatment');
    expect(fieldStep('project.rooms.1.walls.2.openings')).toBe('rooms');
  });

  it("shows the server's errors next to the draft's room and wall", () => {
    const draft = living();
    draft.rooms[1] = { ...draft.rooms[1]!, accent: { wall: 2, finish: { treatmentId: 'shiplap', height: 'wainscot', wainscotHeight: '90"' } } };
    const { origin } = toProject(draft, 'imperial');
    expect(
      normaliseServerErrors(
        {
          'project.rooms.2.walls.0.openings': 'No room.',
          'project.rooms.2.treatment.wainscotHeight': 'Too high.',
          'project.rooms.1.walls.2.fixtures': 'No tub.',
          'project.rooms.0.treatment.id': 'Unknown.',
        },
        origin,
        draft,
      ),
    ).toEqual({
      'project.rooms.1.walls.2.openings': 'No room.',
      'project.rooms.1.accent.wainscotHeight': 'Too high.',
      'project.rooms.1.walls.3.fixtures': 'No tub.',
      'project.treatment': 'Unknown.',
    });
  });
});

describe('the draft against the estimating core', () => {
  it('prices the 5 × 8 ft bathroom with its tub, door and window each on their own wall', () => {
    // Source: src/lib/estimate/sample-data.ts (demo rate book); the core's own checks (validate.ts)
    // refuse a wall whose openings or fixtures do not fit, so a price means every wall was accepted.
    const { project } = toProject(bathroom(), 'imperial');
    const result = estimate(project, sampleRateBook());
    expect(result.price.lowCents).toBeGreaterThan(0);
    expect(result.takeoff.rooms[0]!.walls.map((w) => w.label)).toEqual(['Long wall 1', 'Short wall 1', 'Long wall 2', 'Short wall 2']);
  });

  it('prices a living room with one full-height accent wall as two rooms', () => {
    const draft = bathroom();
    const room = {
      ...newRoom('imperial', 'Living room'),
      length: "14'",
      width: "12'",
      ceilingHeight: "8'",
      counts: { doors: 1, windows: 2, outlets: 3, switches: 1, fixtures: [] },
    };
    room.accent = { wall: 0, finish: { treatmentId: 'board-and-batten', height: 'full', wainscotHeight: '' } };
    const { project } = toProject({ ...draft, rooms: [room] }, 'imperial');
    expect(() => estimate(project, sampleRateBook())).not.toThrow();
    expect(project!.rooms.map((r) => r.treatment.height)).toEqual(['wainscot', 'full']);
  });
});

describe('what the live range is waiting for', () => {
  it('names the wall whose door and window do not fit before anything else', () => {
    const draft = bathroom();
    draft.rooms[0]!.width = "4'";
    draft.rooms[0]!.roomWalls[1] = { ...draft.rooms[0]!.roomWalls[1], doors: 1, windows: 1 };
    const errors = { 'project.treatment': 'Choose a finish.', ...toProject(draft, 'imperial').errors };
    expect(waitingFor(errors, draftWaitingContext(draft, 'imperial'))).toBe('the door and window on Short wall 1');
  });
  it('names a missing size by room, and says nothing when all is answered', () => {
    const draft = { ...newDraft('imperial'), treatmentId: 'shiplap', wainscotHeight: '36"' };
    expect(waitingFor(toProject(draft, 'imperial').errors, draftWaitingContext(draft, 'imperial'))).toBe('the ceiling height');
    expect(waitingFor(toProject(bathroom(), 'imperial').errors, draftWaitingContext(bathroom(), 'imperial'))).toBeNull();
  });
});
