import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { estimate, parseRateBook, sampleProject, sampleRateBook } from '~/lib/estimate/index.ts';
import { roomFrameFor, WallDrawing } from './WallDrawing.tsx';

const rateBook = parseRateBook(sampleRateBook());
const e = estimate(sampleProject(), rateBook);

describe('WallDrawing', () => {
  it('draws a shiplap wall to scale with its boards, boxes and dimensions', () => {
    const wall = e.takeoff.rooms[1]!.walls[0]!;
    const html = renderToStaticMarkup(<WallDrawing wall={wall} units="imperial" treatmentName="Vertical shiplap" />);
    expect(html).toContain('role="img"');
    expect(html).toMatch(/<title id="[^"]+">Bed wall, drawn to scale<\/title>/);
    expect(html).toMatch(/<desc id="[^"]+">Bed wall: 12&#x27; 6&quot; long/);
    expect(html.match(/data-role="strip"/g)).toHaveLength(wall.pieces.filter((p) => p.role === 'strip').length);
    expect(html.match(/data-kind="outlet"/g)).toHaveLength(2);
    expect(html).toContain(`12&#x27; 6&quot;`); // length dimension
    expect(html).toContain('#1F2A2E');
    expect(html).toContain('DM Sans');
    expect(html).toContain('tabular-nums');
    // viewBox in inches: the wall is 150 in wide inside it
    expect(html).toMatch(/<rect x="0" y="0" width="150" height="96"/);
  });

  it('leaves openings white and labels in the firm units', () => {
    const wall = e.takeoff.rooms[0]!.walls[1]!;
    const html = renderToStaticMarkup(<WallDrawing wall={wall} units="metric" />);
    expect(html).toMatch(/data-kind="door"[^>]*fill="#FFFFFF"/);
    expect(html).toContain('3353 mm'); // 132 in × 25.4 = 3352.8 mm
    expect(html).toMatch(/data-role="batten"/);
    expect(html).toMatch(/data-role="cap-rail"/);
    expect(html).toMatch(/data-role="baseboard"/);
  });

  it('draws the casing around a door, from its outside edge', () => {
    const wall = e.takeoff.rooms[0]!.walls[1]!;
    const door = wall.openings.find((o) => o.kind === 'door')!;
    const html = renderToStaticMarkup(<WallDrawing wall={wall} units="imperial" />);
    // Casing 2-1/4 in on both sides (docs/sources.md §30): the 32 in door + 4.5 = 36.5 in wide, from 2.25 in left of it.
    expect(door.casingWidth).toBe(2.25);
    expect(html).toMatch(new RegExp(`data-part="casing" x="${door.offset - 2.25}"[^>]*width="${door.width + 4.5}"`));
  });

  it('shows the ripped last board', () => {
    const project = sampleProject();
    project.rooms[1]!.walls[0]!.length = 146;
    const wall = estimate(project, rateBook).takeoff.rooms[1]!.walls[0]!;
    const html = renderToStaticMarkup(<WallDrawing wall={wall} units="imperial" />);
    expect(wall.boards!.lastWidth).toBeLessThan(wall.boards!.boardWidth);
    expect(html).toContain('class="ripped"');
  });
});

describe('WallDrawing fixtures', () => {
  it('outlines and labels a fixture on the wall', () => {
    const project = sampleProject();
    project.rooms[1]!.walls[0]!.fixtures = [{ kind: 'radiator', offset: 10 }];
    const wall = estimate(project, rateBook).takeoff.rooms[1]!.walls[0]!;
    const html = renderToStaticMarkup(<WallDrawing wall={wall} units="imperial" />);
    expect(html).toMatch(/<g data-kind="radiator" data-placement="behind"><rect x="10" y="72" width="36" height="24"/); // 96 − 24 = 72
    expect(html).toContain('>radiator</text>');
  });

  it('draws the nosing line on a stair wall and the band bottom following it', () => {
    // 12 treads of 10-1/2 in, risers 7-1/2 in: the nosing line runs 126 in and climbs 90 in (docs/sources.md §40).
    const base = e.takeoff.rooms[1]!.walls[0]!;
    const wall = {
      ...base,
      ceilingHeight: 200,
      rake: [
        { x: 0, y: 0 },
        { x: 126, y: 90 },
      ] as [{ x: number; y: number }, { x: number; y: number }],
    };
    const html = renderToStaticMarkup(<WallDrawing wall={wall} units="imperial" />);
    // SVG y is measured down from the ceiling (200 in): the floor at 200, the top of the stair at 200 − 90 = 110.
    expect(html).toContain('data-role="nosing-line" points="0,200 126,110 150,110"');
    const lift = base.bandBottom;
    expect(html).toContain(`data-role="band-bottom" points="0,${200 - lift} 126,${110 - lift} 150,${110 - lift}"`);
    expect(renderToStaticMarkup(<WallDrawing wall={base} units="imperial" />)).not.toContain('nosing-line');
  });
});

describe('WallDrawing measures what the homeowner typed', () => {
  const bathroom = (fixtures: { kind: 'tub' | 'toilet' | 'vanity'; offset: number }[] = []) =>
    estimate(
      {
        rooms: [
          {
            name: 'Bathroom',
            ceilingHeight: 96,
            length: 96,
            width: 60,
            walls: [{ side: 'length', fixtures }, { side: 'width' }],
            treatment: { id: 'beadboard', height: 'wainscot', wainscotHeight: 40 },
          },
        ],
        builtBefore1978: 'no',
        measuredBy: 'homeowner-tape',
      },
      rateBook,
    ).takeoff.rooms[0]!;

  it('dimensions the wainscot from the floor to its top, as typed (40 in = 3\' 4")', () => {
    // Source: computed here, 40 in = 3 ft 4 in; the baseboard's 5-1/4 in is not taken off the typed height.
    const html = renderToStaticMarkup(<WallDrawing wall={bathroom().walls[0]!} units="imperial" />);
    expect(html).toContain('>3&#x27; 4&quot;</text>');
    expect(html).not.toContain('>2&#x27; 10-3/4&quot;</text>');
  });

  it('draws one scale for the room: the 5 ft wall’s drawing is narrower than the 8 ft wall’s', () => {
    const room = bathroom();
    const frame = roomFrameFor(room.walls, 'imperial');
    const widths = room.walls.map((w) =>
      Number(/<svg[^>]* width="([\d.]+)%"/.exec(renderToStaticMarkup(<WallDrawing wall={w} units="imperial" frame={frame} />))![1]),
    );
    expect(widths[0]).toBe(100);
    expect(widths[1]).toBeLessThan(100);
  });

  it('draws beadboard with beads, and no beads on other treatments', () => {
    const wall = bathroom().walls[0]!;
    const html = renderToStaticMarkup(<WallDrawing wall={wall} units="imperial" treatmentKind="beadboard" />);
    // Beads every 2 in inside a 96 in wall: 2 … 94 in is 47, less the sheet seam at 48 in: 46 lines (computed here).
    expect(html.match(/data-part="bead"/g)).toHaveLength(46);
    expect(renderToStaticMarkup(<WallDrawing wall={wall} units="imperial" treatmentKind="board-and-batten" />)).not.toContain('data-part="bead"');
  });

  it('outlines a tub with its rim and a toilet with its tank, where they stand', () => {
    const wall = bathroom([
      { kind: 'tub', offset: 0 },
      { kind: 'toilet', offset: 70 },
    ]).walls[0]!;
    const tub = wall.fixtures!.find((f) => f.kind === 'tub')!;
    const html = renderToStaticMarkup(<WallDrawing wall={wall} units="imperial" />);
    expect(html).toMatch(new RegExp(`<g data-kind="tub" data-placement="${tub.placement}"><rect x="0" y="${96 - tub.height}" width="${tub.width}"`));
    expect(html).toMatch(/<g data-kind="toilet"[^>]*><rect[^>]*><\/rect><rect[^>]*><\/rect><path/);
  });
});
