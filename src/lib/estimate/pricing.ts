/** Price lines, the total and the range, from a takeoff and the owner's rate book. */
import { LEAD_MINOR_REPAIR_SQ_FT } from './cautions.ts';
import { labourAndVisits } from './labour.ts';
import { formatMoney, roundDownTo, roundUpTo } from './money.ts';
import type { RateBook } from './schemas.ts';
import type { Price, PriceLine, Takeoff } from './types.ts';
import { formatLength } from './units.ts';

const r2 = (x: number): number => Math.round(x * 100) / 100;
const pct = (f: number): string => `${r2(f * 100)} %`;

/**
 * Prices a takeoff: materials with markup, labour, extras and tax, then a low–high range by how the
 * walls were measured and whether photos came with them, low rounded down and high up to the
 * rounding step. The minimum job is a floor under each end, not a price to widen: the job's own
 * price is spread first, then low = max(minimum, own low) and high = max(minimum, own high); the
 * middle is max(minimum, own price), and a "Minimum job" line makes the lines add up to it. So a job
 * under the minimum still shows its own upper estimate when that is above the minimum.
 */
export function priceRange(takeoff: Takeoff, rateBook: RateBook): Price {
  const money = (c: number): string => formatMoney(c, rateBook.currency, rateBook.locale);
  const lines: PriceLine[] = [];

  let materialsCents = 0;
  for (const m of takeoff.materials) {
    const total = m.quantity * m.unitCents;
    materialsCents += total;
    lines.push({ group: 'materials', label: m.label, quantity: m.quantity, unit: m.unit, unitCents: m.unitCents, totalCents: total, basis: m.basis });
  }
  const markupCents = Math.round(materialsCents * rateBook.materialMarkup);
  if (markupCents > 0) {
    lines.push({
      group: 'markup',
      label: 'Materials handling and markup',
      quantity: 1,
      unit: 'job',
      unitCents: markupCents,
      totalCents: markupCents,
      basis: `${pct(rateBook.materialMarkup)} of ${money(materialsCents)} materials`,
    });
  }

  const { lines: labour, visits } = labourAndVisits(takeoff, rateBook);
  let labourCents = 0;
  for (const l of labour) {
    const total = Math.round(l.hours * rateBook.labour.rateCents);
    labourCents += total;
    lines.push({
      group: 'labour',
      label: l.label,
      quantity: r2(l.hours),
      unit: 'hour',
      unitCents: rateBook.labour.rateCents,
      totalCents: total,
      basis: l.basis,
    });
  }

  let extrasCents = 0;
  const extra = (label: string, quantity: number, unit: string, unitCents: number, basis: string): void => {
    const total = quantity * unitCents;
    if (total <= 0) return;
    extrasCents += total;
    lines.push({ group: 'extras', label, quantity, unit, unitCents, totalCents: total, basis });
  };
  const X = rateBook.extras;
  if (takeoff.facts.builtBefore1978 !== 'no') {
    const disturbed = takeoff.rooms.filter((r) => r.disturbedPaintSqFt > LEAD_MINOR_REPAIR_SQ_FT);
    if (X.leadSafe.everyPre1978Job || disturbed.length > 0) {
      const why = X.leadSafe.everyPre1978Job
        ? 'the firm sets up lead-safe on every home that may be built before 1978'
        : `removing painted baseboard disturbs more than ${LEAD_MINOR_REPAIR_SQ_FT} sq ft in ${disturbed.length === 1 ? 'one room' : `${disturbed.length} rooms`}`;
      const rooms = X.leadSafe.everyPre1978Job ? takeoff.rooms.length : disturbed.length;
      extra('Lead-safe set-up', 1, 'job', X.leadSafe.perJobCents, `home built before 1978 or not sure; ${why}`);
      extra('Lead-safe containment per room', rooms, 'room', X.leadSafe.perRoomCents, `${rooms} × ${money(X.leadSafe.perRoomCents)}`);
    }
  }
  const high = takeoff.rooms.filter((r) => r.height === 'full' && r.ceilingHeight > X.highCeiling.aboveHeight);
  if (high.length > 0) {
    extra(
      'High ceilings',
      high.length,
      'room',
      X.highCeiling.perRoomCents,
      `full-height work under ceilings above ${formatLength(X.highCeiling.aboveHeight, takeoff.units)} in ${high.map((r) => r.name).join(', ')}`,
    );
  }
  if (takeoff.facts.tripZone) {
    const zone = X.tripZones.find((z) => z.id === takeoff.facts.tripZone);
    if (zone) extra('Trip fee', 1, 'trip', zone.feeCents, `travel zone: ${zone.name}`);
  }

  const taxBase = rateBook.taxOn === 'materials' ? materialsCents + markupCents : materialsCents + markupCents + labourCents + extrasCents;
  const taxCents = Math.round(taxBase * rateBook.taxRate);
  if (taxCents > 0) {
    lines.push({
      group: 'tax',
      label: 'Tax',
      quantity: 1,
      unit: 'job',
      unitCents: taxCents,
      totalCents: taxCents,
      basis: `${pct(rateBook.taxRate)} of ${money(taxBase)} (${rateBook.taxOn === 'materials' ? 'materials' : 'the whole job'})`,
    });
  }
  const subtotalCents = materialsCents + markupCents + labourCents + extrasCents + taxCents;
  const minimumApplied = subtotalCents < rateBook.minimumJobCents;
  const totalCents = minimumApplied ? rateBook.minimumJobCents : subtotalCents;
  if (minimumApplied) {
    lines.push({
      group: 'minimum',
      label: 'Minimum job',
      quantity: 1,
      unit: 'job',
      unitCents: totalCents - subtotalCents,
      totalCents: totalCents - subtotalCents,
      basis: `the firm's minimum job is ${money(rateBook.minimumJobCents)}; this job comes to ${money(subtotalCents)}`,
    });
  }

  const photos = takeoff.facts.photoCount > 0;
  const spread = rateBook.range[takeoff.facts.measuredBy][photos ? 'withPhotos' : 'withoutPhotos'];
  const method = { 'homeowner-estimate': "the homeowner's estimate", 'homeowner-tape': "the homeowner's tape measure", 'site-measure': 'a site measurement' }[
    takeoff.facts.measuredBy
  ];
  const step = rateBook.roundingCents;
  const lowCents = Math.max(rateBook.minimumJobCents, roundDownTo(Math.floor(subtotalCents * (1 - spread.below)), step));
  const highCents = Math.max(lowCents, rateBook.minimumJobCents, roundUpTo(Math.ceil(subtotalCents * (1 + spread.above)), step));
  const whole = step % 100 === 0;
  const fmtRange = (c: number): string => formatMoney(c, rateBook.currency, rateBook.locale, { wholeUnits: whole });
  return {
    currency: rateBook.currency,
    locale: rateBook.locale,
    labour: labour.map((l) => ({ ...l, hours: r2(l.hours) })),
    labourHours: r2(labour.reduce((s, l) => s + l.hours, 0)),
    visits,
    lines,
    materialsCents,
    markupCents,
    labourCents,
    extrasCents,
    taxCents,
    subtotalCents,
    totalCents,
    minimumApplied,
    lowCents,
    highCents,
    spread: {
      below: spread.below,
      above: spread.above,
      basis: `measured from ${method}, ${photos ? 'with photos' : 'without photos'}: ${pct(spread.below)} below to ${pct(spread.above)} above ${money(subtotalCents)}, rounded to ${money(step)}${minimumApplied ? `, and neither end below the minimum job of ${money(rateBook.minimumJobCents)}` : ''}`,
    },
    roundingCents: step,
    rangeText: lowCents === highCents ? fmtRange(lowCents) : `${fmtRange(lowCents)} – ${fmtRange(highCents)}`,
  };
}
