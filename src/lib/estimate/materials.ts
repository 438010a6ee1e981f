/** The materials list: stock pieces from the cut lists, consumables by coverage. */
import { bradLines } from './brad-sizes.ts';
import { cheapestContainers, describePacks, LITRES_PER_US_GALLON } from './containers.ts';
import { beadFeetPerTube, filletFeetPerTube, gallonsFor } from './coverage.ts';
import type { Catalogue } from './schemas.ts';
import { piecesPerSheet } from './sheet-layout.ts';
import { EXACT_LIMIT, stockPiecesSolved } from './stock-cutting.ts';
import { stockLengthsOf, type StockLength } from './stock-lengths.ts';
import type { MaterialLine, RoomTakeoff } from './types.ts';
import { formatArea, formatLength, type Units } from './units.ts';
import { estimatedQuantity, exactQuantity, sheetQuantity, type Allowances } from './waste-rule.ts';

/** Everything the walls need cut, gathered across the project so offcuts are shared between rooms. */
export interface CutRegistry {
  /** Rectangles per sheet id. */
  sheets: Map<string, Array<{ width: number; height: number }>>;
  /** Cut lengths per board or moulding: under its id for its main length, `id@length` for a longer length. */
  lengths: Map<string, number[]>;
}

/** The registry key of a stock item bought in a given length. */
export function lengthKey(stock: { id: string; length: number }, stockLength = stock.length): string {
  return stockLength === stock.length ? stock.id : `${stock.id}@${stockLength}`;
}

const EPS = 1e-9;
const round2 = (x: number): number => Math.round(x * 100) / 100;
const pct = (f: number): string => `${round2(f * 100)} %`;
const plural = (n: number, one: string, many = `${one}s`): string => `${n} ${n === 1 ? one : many}`;

/** Sheets for a set of pieces: each size at its own best layout, the fractions added up. */
export function sheetsForPieces(sheet: { width: number; height: number }, pieces: Array<{ width: number; height: number }>, kerf: number) {
  const groups = new Map<string, { width: number; height: number; count: number }>();
  for (const p of pieces) {
    // Sizes within 1/16 in share a layout; the larger is kept.
    const key = `${Math.ceil(p.width * 16 - 1e-6)}x${Math.ceil(p.height * 16 - 1e-6)}`;
    const g = groups.get(key);
    if (g) {
      g.count += 1;
      g.width = Math.max(g.width, p.width);
      g.height = Math.max(g.height, p.height);
    } else groups.set(key, { width: p.width, height: p.height, count: 1 });
  }
  const sized = [...groups.values()]
    .map((g) => ({ ...g, perSheet: piecesPerSheet(sheet, { width: g.width, height: g.height }, { kerf }) }))
    .sort((a, b) => b.count - a.count);
  const sheets = sized.reduce((s, g) => s + (g.perSheet > 0 ? g.count / g.perSheet : g.count), 0);
  return { sheets, groups: sized };
}

export function materialsFor(rooms: RoomTakeoff[], reg: CutRegistry, catalogue: Catalogue, paint: boolean, units: Units): MaterialLine[] {
  const lines: MaterialLine[] = [];
  const waste = catalogue.wasteFactor;
  const len = (x: number): string => formatLength(x, units);
  const allowances: Allowances = { waste, defect: catalogue.defectAllowance };
  const estimateWaste = Math.max(waste, catalogue.defectAllowance);
  const exactText = `, an exact layout so no waste is added${catalogue.defectAllowance > 0 ? `, plus ${pct(catalogue.defectAllowance)} for defects` : ''}`;
  const estimateText = (why: string): string => `, ${why}${estimateWaste > 0 ? `, plus ${pct(estimateWaste)} waste` : ''}`;

  for (const sheet of catalogue.sheets) {
    const pieces = reg.sheets.get(sheet.id);
    if (!pieces || pieces.length === 0) continue;
    const { sheets, groups } = sheetsForPieces(sheet, pieces, catalogue.kerf);
    const counted = sheetQuantity(groups, allowances);
    const rule = estimateText(
      counted.partSizes > 1 ? `${counted.partSizes} sizes share part-filled sheets (estimated)` : 'sheet layouts per piece size (estimated)',
    );
    const shown = groups.slice(0, 3).map((g) => `${g.count} × ${len(g.width)} × ${len(g.height)} at ${g.perSheet} per sheet`);
    const more = groups.length > 3 ? ` and ${plural(groups.length - 3, 'other size')}` : '';
    lines.push({
      id: `sheet:${sheet.id}`,
      label: sheet.name,
      quantity: counted.quantity,
      unit: 'sheet',
      needed: round2(sheets),
      unitCents: sheet.priceCents,
      piecesPerSheet: groups[0]!.perSheet,
      basis: `${shown.join('; ')}${more} (saw kerf ${len(catalogue.kerf)}) = ${round2(sheets)} sheets${rule}`,
    });
  }

  const stockLines = (items: Array<{ id: string; name: string; length: number; priceCents: number; longerLengths?: StockLength[] }>, prefix: string): void => {
    for (const stock of items) {
      for (const bought of stockLengthsOf(stock)) {
        const cuts = reg.lengths.get(lengthKey(stock, bought.length));
        if (!cuts || cuts.length === 0) continue;
        const main = bought.length === stock.length;
        const solved = stockPiecesSolved(cuts, bought.length, catalogue.kerf);
        const needed = solved.count;
        const rule = solved.exact ? exactText : estimateText(cuts.length > EXACT_LIMIT ? `estimated (over ${EXACT_LIMIT} cuts)` : 'estimated');
        const total = cuts.reduce((s, c) => s + c, 0);
        lines.push({
          id: main ? `${prefix}:${stock.id}` : `${prefix}:${stock.id}@${bought.length}`,
          label: main ? stock.name : `${stock.name}, in ${len(bought.length)} lengths`,
          quantity: solved.exact ? exactQuantity(needed, allowances) : estimatedQuantity(needed, allowances),
          unit: 'piece',
          needed,
          unitCents: bought.priceCents,
          cuts: cuts.length,
          stockLength: bought.length,
          basis: `${plural(cuts.length, 'cut')} totalling ${len(total)} from ${len(bought.length)} lengths (saw kerf ${len(catalogue.kerf)}) = ${plural(needed, 'length')}${rule}`,
        });
      }
    }
  };
  stockLines(catalogue.boards, 'board');
  stockLines(catalogue.mouldings, 'moulding');

  const s = catalogue.supplies;
  const sum = (f: (r: RoomTakeoff) => number): number => rooms.reduce((acc, r) => acc + f(r), 0);
  const panelSqFt = sum((r) => r.panelSqFt);
  // The skirt board on a stair wall is trim too (nailed like the baseboard).
  const trimFeet = sum((r) => r.trimFeet + (r.skirtFeet ?? 0));
  const netSqFt = sum((r) => r.netSqFt);

  const brads = panelSqFt * s.brads.perSqFt + trimFeet * s.brads.perFootOfTrim;
  // With brad sizes listed, one line per size used, each fixing taking the size it needs.
  if (s.brads.sizes.length > 0) lines.push(...bradLines(rooms, catalogue, units));
  else if (brads > 0) {
    lines.push({
      id: 'brads',
      label: s.brads.name,
      quantity: Math.ceil(brads / s.brads.perBox - EPS),
      unit: 'box',
      needed: round2(brads / s.brads.perBox),
      unitCents: s.brads.priceCents,
      basis: `${formatArea(panelSqFt, units)} × ${s.brads.perSqFt} per sq ft + ${round2(trimFeet)} ft of trim × ${s.brads.perFootOfTrim} per ft = ${Math.ceil(brads)} brads, ${s.brads.perBox} per box`,
    });
  }
  if (panelSqFt > 0 && s.adhesive.feetPerSqFt > 0) {
    const feet = panelSqFt * s.adhesive.feetPerSqFt;
    const perTube = beadFeetPerTube(s.adhesive.fluidOunces, s.adhesive.bead);
    lines.push({
      id: 'adhesive',
      label: s.adhesive.name,
      quantity: Math.ceil(feet / perTube - EPS),
      unit: 'tube',
      needed: round2(feet / perTube),
      unitCents: s.adhesive.priceCents,
      basis: `${formatArea(panelSqFt, units)} × ${s.adhesive.feetPerSqFt} ft of bead per sq ft = ${round2(feet)} ft; a ${s.adhesive.fluidOunces} fl oz tube lays ${round2(perTube)} ft of ${len(s.adhesive.bead)} round bead`,
    });
  }
  const caulkFeet = sum((r) => r.caulkFeet);
  if (caulkFeet > 0) {
    const perTube = filletFeetPerTube(s.caulk.fluidOunces, s.caulk.bead);
    lines.push({
      id: 'caulk',
      label: s.caulk.name,
      quantity: Math.ceil(caulkFeet / perTube - EPS),
      unit: 'tube',
      needed: round2(caulkFeet / perTube),
      unitCents: s.caulk.priceCents,
      basis: `${round2(caulkFeet)} ft of joints; a ${s.caulk.fluidOunces} fl oz tube runs ${round2(perTube)} ft of ${len(s.caulk.bead)} fillet`,
    });
  }
  if (netSqFt > 0) {
    lines.push({
      id: 'filler',
      label: s.filler.name,
      quantity: Math.ceil(netSqFt / s.filler.sqFtPerUnit - EPS),
      unit: 'each',
      needed: round2(netSqFt / s.filler.sqFtPerUnit),
      unitCents: s.filler.priceCents,
      basis: `${formatArea(netSqFt, units)} ÷ ${s.filler.sqFtPerUnit} sq ft each`,
    });
  }
  if (paint) {
    // Primer and paint are bought the same way: the gallons for the area, coats and coverage, in the
    // cheapest mix of the containers the rate book lists (only whole gallons when it lists none).
    const coating = (id: 'primer' | 'paint', c: typeof s.paint, sqFt: number): void => {
      if (sqFt <= 0 || c.coats <= 0) return;
      const g = gallonsFor(sqFt, c.coats, c.sqFtPerGallon);
      const basis = `${formatArea(sqFt, units)} × ${plural(c.coats, 'coat')} ÷ ${c.sqFtPerGallon} sq ft per gallon`;
      if (!c.containers) {
        lines.push({ id, label: c.name, quantity: Math.ceil(g - EPS), unit: 'gallon', needed: round2(g), unitCents: c.priceCents, basis });
        return;
      }
      const choice = cheapestContainers(g, c.containers);
      // Metric firms read volumes in litres; the rate book's sizes stay US gallons. Source: docs/sources.md §25.
      const vol = (gal: number): string => (units === 'metric' ? `${round2(gal * LITRES_PER_US_GALLON)} L` : `${round2(gal)} gal`);
      lines.push({
        id,
        label: c.name,
        quantity: 1,
        unit: 'set',
        needed: round2(g),
        unitCents: choice.totalCents,
        packs: choice.packs,
        basis: `${basis} = ${vol(g)}; cheapest containers that cover it: ${describePacks(choice.packs)} (${vol(choice.gallons)})`,
      });
    };
    const primed = rooms.filter((r) => catalogue.treatments.find((t) => t.id === r.treatmentId)?.needsPrimer);
    coating(
      'primer',
      s.primer,
      primed.reduce((acc, r) => acc + r.paintSqFt, 0),
    );
    coating(
      'paint',
      s.paint,
      sum((r) => r.paintSqFt),
    );
  }
  const extenders = sum((r) => r.cutOuts);
  if (extenders > 0) {
    lines.push({
      id: 'box-extenders',
      label: s.boxExtender.name,
      quantity: extenders,
      unit: 'each',
      needed: extenders,
      unitCents: s.boxExtender.priceCents,
      basis: `one for each of ${plural(extenders, 'outlet or switch box', 'outlet and switch boxes')} inside the new wall finish`,
    });
  }
  return lines;
}
