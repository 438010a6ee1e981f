/**
 * Brads in the sizes each fixing needs. A rate book may list brad sizes; each fixing then takes the
 * shortest listed brad that is at least the material's thickness plus the hold it needs behind it
 * (docs/sources.md §46). Without a list, the single brad of the rate book is used for everything, as
 * before. The counts per fixing come from the rate book's brads per sq ft and per foot of trim.
 */
import type { Catalogue } from './schemas.ts';
import type { MaterialLine, RoomTakeoff } from './types.ts';
import { formatLength, type Units } from './units.ts';

/** Hold behind a panel or board laid in construction adhesive, inches: docs/sources.md §46 (common practice, no source). */
export const PANEL_PENETRATION = 0.75;
/** Hold behind trim nailed to the wall (through 1/2 in drywall into the stud), inches: docs/sources.md §46 (common practice, no source). */
export const TRIM_PENETRATION = 1.25;

const EPS = 1e-9;

export interface BradSize {
  name: string;
  /** Inches. */
  length: number;
  perBox: number;
  priceCents: number;
}

/** The shortest listed brad at least `thickness + penetration` long, or undefined when none is. */
export function bradFor(sizes: readonly BradSize[], thickness: number, penetration: number): BradSize | undefined {
  const need = thickness + penetration;
  let best: BradSize | undefined;
  for (const b of sizes) if (b.length >= need - EPS && (!best || b.length < best.length)) best = b;
  return best;
}

/** One fixing of a room: what is nailed, how thick it is, how many brads it takes. */
export interface Fixing {
  what: string;
  thickness: number;
  penetration: number;
  brads: number;
}

/** The fixings of a room: the wall covering (into adhesive) and each kind of trim (into studs). */
export function fixingsOf(room: RoomTakeoff, catalogue: Catalogue): Fixing[] {
  const r = catalogue.supplies.brads;
  const t = catalogue.treatments.find((x) => x.id === room.treatmentId);
  const board = (id: string | undefined) => catalogue.boards.find((b) => b.id === id);
  const sheet = (id: string | undefined) => catalogue.sheets.find((s) => s.id === id);
  const moulding = (id: string | undefined) => catalogue.mouldings.find((m) => m.id === id);
  let panel: number | undefined;
  let trim: number[] = [];
  switch (t?.kind) {
    case 'shiplap':
      panel = t.source.from === 'sheet' ? sheet(t.source.sheetId)?.thickness : board(t.source.boardId)?.thickness;
      break;
    case 'beadboard':
      panel = sheet(t.sheetId)?.thickness;
      break;
    case 'board-and-batten':
      panel = sheet(t.backingSheetId)?.thickness;
      trim = [board(t.battenId)?.thickness ?? 0, board(t.topRailId)?.thickness ?? 0];
      break;
    case 'flat-panel':
      panel = sheet(t.backingSheetId)?.thickness;
      trim = [board(t.stileId)?.thickness ?? 0, board(t.railId)?.thickness ?? 0];
      break;
    case 'picture-frame':
      trim = [moulding(t.mouldingId)?.thickness ?? 0];
      break;
  }
  const out: Fixing[] = [];
  if (room.panelSqFt > 0 && panel !== undefined)
    out.push({ what: 'wall covering', thickness: panel, penetration: PANEL_PENETRATION, brads: room.panelSqFt * r.perSqFt });
  // The room's trim run, split into the cap rail, the new baseboard and the treatment's own trim.
  const base = room.baseboardRemovedFeet > 0 ? room.baseboardFeet : 0;
  const own = Math.max(0, room.trimFeet - room.capRailFeet - base);
  const cap = moulding(catalogue.capRailId)?.thickness ?? 0;
  const baseboard = moulding(catalogue.baseboardId)?.thickness ?? 0;
  // The treatment's trim takes one size, long enough for its thickest member.
  if (own > 0) out.push({ what: 'trim', thickness: Math.max(...trim, 0), penetration: TRIM_PENETRATION, brads: own * r.perFootOfTrim });
  if (room.capRailFeet > 0) out.push({ what: 'cap rail', thickness: cap, penetration: TRIM_PENETRATION, brads: room.capRailFeet * r.perFootOfTrim });
  if (base > 0) out.push({ what: 'baseboard', thickness: baseboard, penetration: TRIM_PENETRATION, brads: base * r.perFootOfTrim });
  // The skirt board along a stair is nailed like the baseboard it takes the place of: left out, one
  // more step (more skirt, less baseboard) could need fewer brads.
  const skirtId = catalogue.skirtBoardId ?? catalogue.baseboardId;
  const skirt = board(skirtId)?.thickness ?? moulding(skirtId)?.thickness ?? baseboard;
  if ((room.skirtFeet ?? 0) > 0) out.push({ what: 'skirt board', thickness: skirt, penetration: TRIM_PENETRATION, brads: room.skirtFeet! * r.perFootOfTrim });
  return out;
}

/**
 * One materials line per brad size used, when the rate book lists sizes. Fixings that no listed brad is
 * long enough for take the rate book's single brad.
 */
export function bradLines(rooms: RoomTakeoff[], catalogue: Catalogue, units: Units): MaterialLine[] {
  const r = catalogue.supplies.brads;
  const sizes: BradSize[] = r.sizes;
  const fallback: BradSize = { name: r.name, length: 0, perBox: r.perBox, priceCents: r.priceCents };
  const len = (x: number): string => formatLength(x, units);
  const used = new Map<BradSize, { brads: number; why: Map<string, number> }>();
  for (const room of rooms) {
    for (const f of fixingsOf(room, catalogue)) {
      if (f.brads <= 0) continue;
      const b = bradFor(sizes, f.thickness, f.penetration) ?? fallback;
      const entry = used.get(b) ?? { brads: 0, why: new Map<string, number>() };
      entry.brads += f.brads;
      const key = `${f.what} ${len(f.thickness)} + ${len(f.penetration)} hold = ${len(f.thickness + f.penetration)}`;
      entry.why.set(key, (entry.why.get(key) ?? 0) + f.brads);
      used.set(b, entry);
    }
  }
  const lines: MaterialLine[] = [];
  for (const [b, { brads, why }] of [...used].sort((x, y) => x[0].length - y[0].length)) {
    const rule = b === fallback ? 'no listed brad is long enough' : `the shortest listed brad at least that long`;
    const parts = [...why].map(([k, n]) => `${Math.ceil(n - EPS)} for ${k}`);
    lines.push({
      id: b === fallback ? 'brads' : `brads@${b.length}`,
      label: b.name,
      quantity: Math.ceil(brads / b.perBox - EPS),
      unit: 'box',
      needed: Math.round((brads / b.perBox) * 100) / 100,
      unitCents: b.priceCents,
      basis: `${parts.join('; ')} (${rule}) = ${Math.ceil(brads - EPS)} brads, ${b.perBox} per box`,
    });
  }
  return lines;
}
