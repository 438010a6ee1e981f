/** Safety cautions that apply to a project, each deferring to local codes and licensed professionals. */
import { fixtureCautions } from './fixture-cautions.ts';
import type { Catalogue, Project } from './schemas.ts';
import type { Caution, RoomTakeoff } from './types.ts';

// Source: 40 CFR 745.83 minor repair and maintenance: 6 sq ft or less of painted surface per room (interior); docs/sources.md §5.
export const LEAD_MINOR_REPAIR_SQ_FT = 6;

function namesOf(rooms: RoomTakeoff[]): string[] {
  return rooms.map((r) => r.name);
}

/**
 * Which cautions apply and why. Triggers (sections of docs/sources.md):
 * any wood finish over an electrical box → box extender and power off (NEC 314.20, §4);
 * built before 1978 or not sure → lead-safe practices (EPA RRP rule, §5);
 * damp room → moisture-resistant materials, sealed faces, no wood in the tub or shower surround (IRC R307.2, §10);
 * full-height work → ladder safety (common practice);
 * a stair wall → a stair platform or stair-rated ladder, never a ladder on the treads (common practice, §43).
 */
export function cautionsFor(project: Project, rooms: RoomTakeoff[], catalogue: Catalogue): Caution[] {
  const out: Caution[] = [];

  const boxed = rooms.filter((r) => r.cutOuts > 0);
  if (boxed.length > 0) {
    const n = boxed.reduce((s, r) => s + r.cutOuts, 0);
    out.push({
      id: 'electrical-boxes',
      title: 'Outlets and switches inside the new wall finish',
      text:
        `${n === 1 ? 'One outlet or switch box sits' : `${n} outlet and switch boxes sit`} inside the new finish. ` +
        'Wood, MDF and plywood count as a combustible surface, so the electrical code asks for each box to be brought flush with the new face, ' +
        'usually with a listed box extender (NEC 314.20); the estimate includes one per box. ' +
        'The power to each box is switched off at the breaker and checked dead before a cover plate comes off. ' +
        'Your local electrical code and inspector have the final word, and any wiring change is work for a licensed electrician.',
      rooms: namesOf(boxed),
    });
  }

  const capConflict = rooms.filter((r) => r.walls.some((w) => w.boxes.some((b) => b.capRailCrosses)));
  if (capConflict.length > 0) {
    out.push({
      id: 'cap-rail-box',
      title: 'The cap rail meets an electrical box',
      text:
        'At the chosen height the cap rail would run through an outlet or switch box. Either the wainscot height changes a little, ' +
        'or the box is moved, which is work for a licensed electrician under your local electrical code. We will settle this at the site visit.',
      rooms: namesOf(capConflict),
    });
  }

  if (project.builtBefore1978 !== 'no') {
    const over = rooms.filter((r) => r.disturbedPaintSqFt > LEAD_MINOR_REPAIR_SQ_FT);
    const when = project.builtBefore1978 === 'yes' ? 'Your home was built before 1978' : "You weren't sure whether your home was built before 1978";
    out.push({
      id: 'lead-safe',
      title: 'Lead-based paint in older homes',
      text:
        `${when}, so older painted surfaces may contain lead until a test shows otherwise. ` +
        "The EPA's Renovation, Repair and Painting rule (40 CFR 745) requires paid work that disturbs more than 6 sq ft of painted surface in a room " +
        '— removing painted baseboard counts in full — to be done by an EPA-certified firm, led by a certified renovator, with lead-safe work practices: ' +
        'containment, no open-flame burning or high-speed sanding without a shroud and HEPA vacuum, and careful cleaning and checking afterwards. ' +
        (over.length > 0
          ? `This job disturbs more than that in ${over.map((r) => r.name).join(', ')}. `
          : 'Nailing new work over sound paint does not by itself disturb it; we will confirm the scope at the site visit. ') +
        'State and local rules can be stricter than the federal rule; they apply as well.',
      rooms: namesOf(rooms),
    });
  }

  const damp = rooms.filter((r) => r.damp);
  if (damp.length > 0) {
    const notMr = damp.filter((r) => {
      const t = catalogue.treatments.find((x) => x.id === r.treatmentId);
      if (!t) return false;
      const ids: string[] = [];
      if (t.kind === 'shiplap') ids.push(t.source.from === 'sheet' ? t.source.sheetId : t.source.boardId);
      if (t.kind === 'beadboard') ids.push(t.sheetId);
      if ((t.kind === 'board-and-batten' || t.kind === 'flat-panel') && t.backingSheetId) ids.push(t.backingSheetId);
      return ids.some((id) => {
        const stock = catalogue.sheets.find((s) => s.id === id) ?? catalogue.boards.find((b) => b.id === id);
        return stock !== undefined && !stock.moistureResistant;
      });
    });
    out.push({
      id: 'damp-room',
      title: 'Moisture in bathrooms and other damp rooms',
      text:
        'Standard MDF swells when it gets wet. In a damp room the work should use moisture-resistant MDF or solid wood, ' +
        'with every face, edge and cut end primed and the bottom edges sealed, and a good bathroom fan helps it last. ' +
        (notMr.length > 0
          ? `The material chosen for ${notMr.map((r) => r.name).join(', ')} is not listed as moisture resistant; we will suggest an alternative. `
          : '') +
        'Your local building code governs materials in wet areas.',
      rooms: namesOf(damp),
    });
    out.push({
      id: 'wet-zone',
      title: 'Not inside a tub or shower surround',
      text:
        'Walls around a tub with a shower head and inside a shower need a nonabsorbent surface to at least 6 ft above the floor ' +
        '(IRC R307.2), so wood or MDF panelling stops outside that zone. Your local building code and inspector have the final word.',
      rooms: namesOf(damp),
    });
  }

  const full = rooms.filter((r) => r.height === 'full');
  if (full.length > 0) {
    out.push({
      id: 'ladder',
      title: 'Working at height',
      text:
        'Full-height work is done from a ladder or a work platform. The right height of stepladder stands fully opened and locked on firm, level floor, ' +
        "no one stands on its top or top step, and the maker's labels are followed; taller ceilings call for a platform or scaffold. " +
        'Please keep children and pets out of the room while we work. Workplace safety rules and your local codes apply.',
      rooms: namesOf(full),
    });
  }

  // Work over a stair (docs/sources.md §43; common practice, no source).
  const stairs = rooms.filter((r) => r.walls.some((w) => w.rake !== undefined));
  if (stairs.length > 0) {
    out.push({
      id: 'stair',
      title: 'Working over a stair',
      text:
        'A stair wall is worked from a stair platform, or from a ladder made and rated for use on stairs, set up as its maker says. ' +
        'A ladder never stands on the treads with its feet at different heights, and is never propped on boxes or books to level it. ' +
        'The stair stays closed to the household while we work, and the treads are kept clear of offcuts and tools. ' +
        'Workplace safety rules and your local codes apply; a stair that is loose or out of the code limits is a matter for a licensed professional before it is trimmed.',
      rooms: namesOf(stairs),
    });
  }
  out.push(...fixtureCautions(rooms));
  out.push({
    id: 'tools',
    title: 'Saws, nailers and dust',
    text:
      'The crew cuts and nails in or near the room, with eye and hearing protection and dust collection; cutting MDF makes fine dust, ' +
      'so doors to the rest of the home stay closed. Please keep the work area clear of children and pets. ' +
      "Tools are used as their makers' instructions and workplace safety rules require.",
    rooms: namesOf(rooms),
  });
  return out;
}
