/** Checks on a project beyond its schema: things only the rate book or the wall's own numbers can tell. */
import { EstimateInputError, fieldsFromZod } from './errors.ts';
import { fixtureProblems } from './fixtures.ts';
import { DEFAULT_DOOR, DEFAULT_WINDOW, OPENING_SPACING, tryPlaceOpenings } from './geometry.ts';
import { projectSchema, rateBookSchema, type Catalogue, type Project, type RateBook } from './schemas.ts';
import { stairWallProblems } from './stair-checks.ts';
import { formatLength, type Units } from './units.ts';

const fmt = (x: number): string => `${Math.round(x * 100) / 100} in`;

/**
 * Parses and checks a project against the catalogue. Throws EstimateInputError whose `fields` map
 * names each bad field (e.g. `rooms.0.walls.1.openings.0.width`).
 */
export function validateProject(input: unknown, catalogue: Catalogue, tripZones?: Array<{ id: string }>, units: Units = 'imperial'): Project {
  const parsed = projectSchema.safeParse(input);
  if (!parsed.success) throw new EstimateInputError(fieldsFromZod(parsed.error));
  return checkProject(parsed.data, catalogue, tripZones, units);
}

/**
 * The checks of `validateProject` that need the rate book or the wall's own numbers, for a project
 * that has already passed `projectSchema` (an API body parsed once by its request schema).
 */
export function checkProject(project: Project, catalogue: Catalogue, tripZones?: Array<{ id: string }>, units: Units = 'imperial'): Project {
  const len = (x: number): string => formatLength(x, units);
  const fields: Record<string, string> = {};
  const bad = (path: string, message: string): void => {
    if (!(path in fields)) fields[path] = message;
  };
  const baseboard = catalogue.mouldings.find((m) => m.id === catalogue.baseboardId);
  const baseHeight = baseboard?.width ?? 0;

  project.rooms.forEach((room, r) => {
    const rp = `rooms.${r}`;
    const treatment = catalogue.treatments.find((t) => t.id === room.treatment.id);
    const offered = catalogue.treatments.filter((t) => t.enabled).map((t) => t.id);
    if (!treatment) bad(`${rp}.treatment.id`, `Unknown treatment "${room.treatment.id}"; this firm offers: ${offered.join(', ') || 'none'}.`);
    else if (!treatment.enabled)
      bad(`${rp}.treatment.id`, `This firm does not offer "${treatment.name}" at the moment; it offers: ${offered.join(', ') || 'none'}.`);

    if (room.treatment.height === 'wainscot') {
      const top = room.treatment.wainscotHeight ?? Math.round(room.ceilingHeight / 3);
      if (top >= room.ceilingHeight - 6) {
        bad(
          `${rp}.treatment.wainscotHeight`,
          `Wainscot height (${fmt(top)}) must be at least 6 in below the ceiling (${fmt(room.ceilingHeight)}); choose full height instead.`,
        );
      }
      if (top <= baseHeight + 6)
        bad(`${rp}.treatment.wainscotHeight`, `Wainscot height (${fmt(top)}) must be at least 6 in above the baseboard (${fmt(baseHeight)}).`);
    } else if (room.treatment.wainscotHeight !== undefined) {
      bad(`${rp}.treatment.wainscotHeight`, 'Wainscot height only applies to a wainscot; leave it out for full height.');
    }

    room.walls.forEach((wall, w) => {
      const wp = `${rp}.walls.${w}`;
      if (wall.length !== undefined && wall.side !== undefined) bad(`${wp}.side`, 'Give the wall a length or a side of the room, not both.');
      if (wall.length === undefined && wall.side === undefined) bad(`${wp}.length`, 'Wall length is required (or choose the room side it is on).');
      if (wall.side === 'length' && room.length === undefined) bad(`${rp}.length`, 'Room length is required for walls measured along the room length.');
      if (wall.side === 'width' && room.width === undefined) bad(`${rp}.width`, 'Room width is required for walls measured along the room width.');
      const length = wall.length ?? (wall.side === 'width' ? room.width : room.length);
      if (length === undefined) return;

      const errorsBefore = Object.keys(fields).length;
      const fixed: Array<{ a: number; b: number; o: number }> = [];
      wall.openings.forEach((o, i) => {
        const op = `${wp}.openings.${i}`;
        const d = o.kind === 'door' ? DEFAULT_DOOR : DEFAULT_WINDOW;
        const width = o.width ?? d.width;
        const height = o.height ?? d.height;
        const sill = o.sillHeight ?? d.sillHeight;
        if (width > length) bad(`${op}.width`, `Opening width (${fmt(width)}) is more than the wall is long (${fmt(length)}).`);
        if (sill + height > room.ceilingHeight) {
          bad(`${op}.height`, `The opening's top (sill ${fmt(sill)} + height ${fmt(height)}) is above the ceiling (${fmt(room.ceilingHeight)}).`);
        }
        if (o.offset !== undefined) {
          if (o.count > 1) bad(`${op}.offset`, 'A distance from the left end applies to one opening; give each counted opening its own entry.');
          else if (o.offset + width > length + 1e-6)
            bad(`${op}.offset`, `The opening runs past the wall's end (${fmt(o.offset)} + ${fmt(width)} > ${fmt(length)}).`);
          else fixed.push({ a: o.offset, b: o.offset + width, o: i });
        }
      });
      // Measured openings may not overlap: the takeoff would take the overlap off the wall twice.
      fixed.sort((x, y) => x.a - y.a);
      for (let i = 1; i < fixed.length; i++) {
        if (fixed[i]!.a < fixed[i - 1]!.b - 1e-6) bad(`${wp}.openings.${fixed[i]!.o}.offset`, 'This opening overlaps another opening on the same wall.');
      }
      if (Object.keys(fields).length > errorsBefore) return;
      // Counted openings must each find room beside the measured ones, not just add up to less than the wall.
      const placement = tryPlaceOpenings(wall.openings, length, catalogue.casing.width);
      if (!placement.ok) {
        const kinds = (list: Array<{ kind: string; width: number }>): string =>
          list.map((o) => `${o.kind === 'door' ? 'a door' : 'a window'} ${len(o.width)} wide`).join(', ');
        const free = placement.free.filter(([a, b]) => b - a >= 0.01).map(([a, b]) => len(b - a));
        bad(
          `${wp}.openings`,
          `The doors and windows without a distance from the left end do not fit on this ${len(length)} wall beside the others: no room for ${kinds(placement.unplaced)} (each needs ${len(OPENING_SPACING)} clear on both sides, and room for its casing; the free stretches are ${free.join(', ') || 'none'}). Give each opening its distance from the left end, or check the count.`,
        );
      } else {
        for (const [path, message] of Object.entries(fixtureProblems(wall.fixtures, length, placement.openings, wp, len))) bad(path, message);
        if (wall.stair && Object.keys(fields).length === errorsBefore) {
          const wallName = `${room.name}, ${wall.label ?? `wall ${w + 1}`}`;
          const stairWall = { ...wall, stair: wall.stair };
          for (const [path, message] of Object.entries(
            stairWallProblems({ room, wall: stairWall, wallName, wp, length, treatment, catalogue, openings: placement.openings, units }),
          ))
            bad(path, message);
        }
      }
    });
  });
  if (project.tripZone !== undefined && tripZones && !tripZones.some((z) => z.id === project.tripZone)) {
    bad('tripZone', `Unknown trip zone "${project.tripZone}"; expected one of: ${tripZones.map((z) => z.id).join(', ') || 'none'}.`);
  }
  if (Object.keys(fields).length > 0) throw new EstimateInputError(fields);
  return project;
}

/** Parses a rate book; errors name fields under `rateBook.` so they never mix with the project's. */
export function parseRateBook(input: unknown): RateBook {
  const parsed = rateBookSchema.safeParse(input);
  if (!parsed.success) throw new EstimateInputError(fieldsFromZod(parsed.error, 'rateBook'), 'The rate book needs another look.');
  return parsed.data;
}
