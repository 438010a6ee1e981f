/**
 * Painting labour: each coating (primer, paint) is one line, its hours the area × coats ÷ the paint
 * rate, with each treatment's area weighted by its painting factor (grooves and gaps take longer
 * than a flat face). Primer goes only on treatments that need it. docs/sources.md §27.
 */
import type { RateBook } from './schemas.ts';
import type { LabourLine, Takeoff } from './types.ts';
import { formatArea } from './units.ts';

export interface PaintingLabour {
  lines: LabourLine[];
  /** Coats that will actually be put on (zero for a coating with no area). */
  primerCoats: number;
  paintCoats: number;
}

export function paintingLabour(takeoff: Takeoff, rateBook: RateBook): PaintingLabour {
  const lines: LabourLine[] = [];
  if (!takeoff.facts.paint || takeoff.paintSqFt <= 0) return { lines, primerCoats: 0, paintCoats: 0 };
  const rate = rateBook.labour.paintSqFtPerHour;
  const s = rateBook.catalogue.supplies;
  const treatmentOf = (id: string) => rateBook.catalogue.treatments.find((t) => t.id === id);

  const coating = (label: string, coats: number, rooms: Takeoff['rooms']): number => {
    const sqFt = rooms.reduce((a, r) => a + r.paintSqFt, 0);
    if (coats <= 0 || sqFt <= 0) return 0;
    const weighted = rooms.reduce((a, r) => a + r.paintSqFt * (treatmentOf(r.treatmentId)?.paintFactor ?? 1), 0);
    const slow = [...new Set(rooms.map((r) => r.treatmentId))]
      .map(treatmentOf)
      .filter((t) => t !== undefined && t.paintFactor !== 1)
      .map((t) => `${t!.name.toLowerCase()} × ${t!.paintFactor}`);
    const factorText = slow.length > 0 ? `, weighted for grooves and gaps (${slow.join(', ')}) to ${formatArea(weighted, takeoff.units)}` : '';
    lines.push({
      task: 'paint',
      label: `${label} (${coats} ${coats === 1 ? 'coat' : 'coats'})`,
      hours: (weighted * coats) / rate,
      basis: `${formatArea(sqFt, takeoff.units)}${factorText} × ${coats} ${coats === 1 ? 'coat' : 'coats'} ÷ ${rate} sq ft per hour per coat`,
    });
    return coats;
  };
  const primed = takeoff.rooms.filter((r) => treatmentOf(r.treatmentId)?.needsPrimer);
  const primerCoats = coating('Prime', s.primer.coats, primed);
  const paintCoats = coating('Paint', s.paint.coats, takeoff.rooms);
  return { lines, primerCoats, paintCoats };
}
