import { describe, expect, it } from 'vitest';
import { waitingFor, waitingForLabel, type WaitingContext } from './waiting-for';

// Wall names follow src/lib/shared/wall-names.ts: clockwise from a wall along the room's length
// (common practice, no source). Phrasing is ours.

const bathroom: WaitingContext = {
  rooms: [
    {
      name: 'Bathroom',
      length: 96,
      width: 60,
      walls: [
        { side: 'length', fixtures: [{ kind: 'tub' }] },
        { side: 'width', openings: [{ kind: 'door' }] },
        { side: 'length', openings: [{ kind: 'window', count: 1 }] },
        { side: 'width' },
      ],
    },
  ],
};

describe('what the live range is waiting for', () => {
  it('names the door on the wall the server refused, by the wall name the homeowner saw', () => {
    expect(waitingForLabel('project.rooms.0.walls.1.openings', bathroom)).toBe('the door on Short wall 1');
    expect(waitingForLabel('project.rooms.0.walls.2.openings.0.width', bathroom)).toBe('the window on Long wall 2');
  });

  it('names a wall with both doors and windows by both', () => {
    const ctx: WaitingContext = { rooms: [{ name: 'Hall', walls: [{ length: 48, openings: [{ kind: 'door' }, { kind: 'window', count: 2 }] }] }] };
    expect(waitingForLabel('rooms.0.walls.0.openings', ctx)).toBe('the door and windows on Wall 1');
  });

  it('names a fixture by what it is', () => {
    expect(waitingForLabel('project.rooms.0.walls.0.fixtures.0.offset', bathroom)).toBe('the tub on Long wall 1');
    expect(waitingForLabel('project.rooms.0.walls.0.fixtures', bathroom)).toBe('the tub on Long wall 1');
  });

  it('prefers a label the wall carries', () => {
    const ctx: WaitingContext = { rooms: [{ name: 'Den', walls: [{ label: 'Short wall 2', side: 'width', openings: [{ kind: 'door' }] }] }] };
    expect(waitingForLabel('project.rooms.0.walls.0.openings', ctx)).toBe('the door on Short wall 2');
  });

  it('names room sizes and heights plainly', () => {
    expect(waitingForLabel('project.rooms.0.length', bathroom)).toBe('the room length');
    expect(waitingForLabel('project.rooms.0.width', bathroom)).toBe('the room width');
    expect(waitingForLabel('project.rooms.0.ceilingHeight', bathroom)).toBe('the ceiling height');
    expect(waitingForLabel('project.rooms.0.walls', bathroom)).toBe('a wall to cover');
    expect(waitingForLabel('project.rooms.0.walls.3.length', { rooms: [{ name: 'x' }] })).toBe('the length of Wall 4');
    expect(waitingForLabel('project.wainscotHeight', bathroom)).toBe('the wainscot height');
    expect(waitingForLabel('project.rooms.0.treatment.wainscotHeight', bathroom)).toBe('the wainscot height');
    expect(waitingForLabel('project.treatment', bathroom)).toBe('a choice of treatment');
  });

  it('says which room when there is more than one', () => {
    const two: WaitingContext = { rooms: [...bathroom.rooms, { name: 'Living room' }] };
    expect(waitingForLabel('project.rooms.1.length', two)).toBe('the room length (Living room)');
    expect(waitingForLabel('project.rooms.0.walls.1.openings', two)).toBe('the door on Short wall 1 (Bathroom)');
  });

  it('falls back to a general phrase for a path it does not know, and for junk', () => {
    expect(waitingForLabel('project.somethingNew', bathroom)).toBe('one of your answers');
    expect(waitingForLabel('project.rooms.7.walls.9.openings', bathroom)).toBe('the doors and windows on Wall 10');
    expect(waitingForLabel('', { rooms: [] })).toBe('one of your answers');
  });

  it('takes the first problem in the order of the steps, and nothing when all is well', () => {
    expect(waitingFor({}, bathroom)).toBeNull();
    expect(waitingFor({ 'project.treatment': 'Choose', 'project.rooms.0.walls.1.openings': 'Too many' }, bathroom)).toBe('the door on Short wall 1');
    expect(waitingFor({ 'project.rooms.10.length': 'x', 'project.rooms.2.length': 'y' }, { rooms: [] })).toBe('the room length (Room 3)');
  });
});
