import type { Estimate } from '~/lib/estimate';
import type { HomeownerEstimate } from '~/lib/shared/homeowner-estimate';

export type { HomeownerEstimate };

/** What a homeowner sees of an estimate: the firm's unit rates stay on the server. */
export function presentForHomeowner(result: Estimate): HomeownerEstimate {
  const { takeoff, price } = result;
  const groups: HomeownerEstimate['groups'] = [
    { id: 'materials', label: 'Materials and supplies', cents: price.materialsCents + price.markupCents },
    { id: 'labour', label: `Installation${takeoff.facts.paint ? ' and painting' : ''}`, cents: price.labourCents },
    { id: 'extras', label: 'Set-up and extras', cents: price.extrasCents },
    { id: 'tax', label: 'Tax', cents: price.taxCents },
  ];
  return {
    units: takeoff.units,
    currency: price.currency,
    locale: price.locale,
    range: { lowCents: price.lowCents, highCents: price.highCents, text: price.rangeText },
    rangeReason: rangeReason(takeoff.facts.measuredBy, takeoff.facts.photoCount > 0),
    minimumApplied: price.minimumApplied,
    groups: groups.filter((g) => g.cents > 0),
    extras: price.lines.filter((l) => l.group === 'extras').map((l) => l.label),
    rooms: takeoff.rooms.map((room) => ({
      name: room.name,
      treatmentName: room.treatmentName,
      height: room.height,
      netSqFt: room.netSqFt,
      walls: room.walls,
    })),
    materials: takeoff.materials.map((m) => ({ label: m.label, quantity: m.quantity, unit: m.unit })),
    cautions: takeoff.cautions,
    notes: takeoff.notes,
  };
}

function rangeReason(measuredBy: string, photos: boolean): string {
  const how =
    measuredBy === 'site-measure'
      ? 'The walls were measured on site'
      : measuredBy === 'homeowner-tape'
        ? 'You measured with a tape'
        : 'These are your estimates of the sizes';
  return `${how}${photos ? ' and sent photos' : ' without photos'}, so the range is ${
    measuredBy === 'site-measure' && photos ? 'narrow' : photos || measuredBy === 'homeowner-tape' ? 'moderate' : 'wide'
  }. The final price follows a site visit.`;
}
