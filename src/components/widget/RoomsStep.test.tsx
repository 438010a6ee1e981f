import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { newRoom, type RoomDraft } from './draft';
import { RoomsStep } from './RoomsStep';

const render = (rooms: RoomDraft[], errors = {}) => renderToStaticMarkup(<RoomsStep rooms={rooms} units="imperial" errors={errors} onChange={() => {}} />);

describe('RoomsStep', () => {
  it('shows a message about the project as a whole, such as one too big for an online estimate', () => {
    const message = 'This project is too big for one online estimate: 130 walls (at most 120).';
    expect(render([newRoom('imperial', 'Hallway')], { 'project.rooms': message })).toContain(`role="alert">${message}</p>`);
  });

  it("shows a door that cannot fit inside that wall's own box, before the homeowner presses Next", () => {
    // Source: docs/sources.md §30 and src/lib/estimate/geometry.ts — a counted door is 36 in wide
    // and needs 3 in clear each side, so a 5 ft wall holds one door but not a door and a window.
    const room = { ...newRoom('imperial', 'Bathroom'), length: "8'", width: "4'", ceilingHeight: "8'", placement: 'by-wall' as const };
    room.roomWalls = [room.roomWalls[0], { ...room.roomWalls[1], doors: 1, windows: 1 }, room.roomWalls[2], room.roomWalls[3]];
    const html = render([room]);
    const wall = html.slice(html.indexOf('data-testid="wall-0-1"'), html.indexOf('data-testid="wall-0-2"'));
    expect(wall).toContain('Short wall 1');
    expect(wall).toContain('The door and window add up to 6&#x27; 0&quot;, more than this 4&#x27; 0&quot; wall.');
  });

  it('names each wall clockwise from the first long wall and starts with empty fields and example placeholders', () => {
    const html = render([newRoom('imperial')]);
    expect(html).toContain('placeholder="e.g. 12&#x27; 6&quot;"');
    expect(html).not.toMatch(/value="14/);
    const withSizes = render([{ ...newRoom('imperial'), length: "8'", width: "5'" }]);
    // Source: src/lib/shared/wall-names.ts (clockwise from a wall along the room's length).
    expect(withSizes.indexOf('Long wall 1')).toBeLessThan(withSizes.indexOf('Short wall 1'));
    expect(withSizes.indexOf('Short wall 1')).toBeLessThan(withSizes.indexOf('Long wall 2'));
  });

  it('ticks "gets damp" for a room named bathroom and leaves a bedroom unticked', () => {
    // Source: docs/sources.md §10 (bathrooms are damp rooms).
    const damp = (name: string) => /<input type="checkbox"[^>]*checked=""[^>]*\/>This room gets damp/.test(render([newRoom('imperial', name)]));
    expect(damp('Bathroom')).toBe(true);
    expect(damp('Bedroom')).toBe(false);
  });
});

describe('RoomsStep and the server', () => {
  it("shows the server's message about a wall we placed things on, with the wall's name", () => {
    // Source: docs/sources.md §30 — a firm's own casing may be wider than the usual 2-1/4 in, so the
    // server can refuse a wall the browser accepted.
    const room = {
      ...newRoom('imperial', 'Hallway'),
      length: "12'",
      width: "4'",
      ceilingHeight: "8'",
      counts: { doors: 1, windows: 0, outlets: 0, switches: 0, fixtures: [] },
    };
    const html = render([room], { 'project.rooms.0.walls.0.openings': "No room for a door 3' wide." });
    expect(html).toContain('role="alert">Long wall 1: No room for a door 3&#x27; wide.</p>');
  });
});
