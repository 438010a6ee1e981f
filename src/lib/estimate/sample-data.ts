/**
 * DEMO DATA — INVENTED. A sample rate book and a sample project for the demo seed, tests and the
 * landing page. The prices, productivity rates, time per item, extras, tax and range widths below
 * are made up for demonstration; they are not trade data and not advice. Physical sizes (4 × 8 ft
 * sheets, PS 20 dressed lumber, 10.1 fl oz tubes) are real-world conventions.
 */
import type { ProjectInput, RateBookInput } from './schemas.ts';

export function sampleRateBook(): RateBookInput {
  return {
    units: 'imperial',
    currency: 'USD',
    locale: 'en-US',
    catalogue: {
      wasteFactor: 0.1,
      defectAllowance: 0,
      kerf: 0.125,
      trimEndAllowance: 1,
      sheets: [
        { id: 'ply-4x8-quarter', name: '1/4 in sanded plywood, 4 × 8 ft', width: 48, height: 96, thickness: 0.25, priceCents: 3200 },
        { id: 'mdf-4x8-quarter', name: '1/4 in MDF, 4 × 8 ft', width: 48, height: 96, thickness: 0.25, priceCents: 2400 },
        {
          id: 'mr-mdf-4x8-half',
          name: '1/2 in moisture-resistant MDF, 4 × 8 ft',
          width: 48,
          height: 96,
          thickness: 0.5,
          priceCents: 5600,
          moistureResistant: true,
        },
        { id: 'beadboard-4x8', name: 'Beadboard panel, 4 × 8 ft', width: 48, height: 96, thickness: 0.25, priceCents: 3800 },
      ],
      boards: [
        { id: 'pine-1x6-8', name: '1x6 pine board, 8 ft', nominal: '1x6', length: 96, priceCents: 1150 },
        { id: 'shiplap-1x6-8', name: '1x6 milled shiplap, 8 ft', nominal: '1x6', faceWidth: 5.125, length: 96, priceCents: 1400 },
        { id: 'mdf-1x3-8', name: '1x3 primed MDF batten, 8 ft', nominal: '1x3', length: 96, priceCents: 650 },
        { id: 'mdf-1x4-8', name: '1x4 primed MDF board, 8 ft', nominal: '1x4', length: 96, priceCents: 850 },
        { id: 'pine-1x6-16', name: '1x6 pine skirt board, 16 ft', nominal: '1x6', length: 192, priceCents: 2600 }, // demo price
      ],
      mouldings: [
        { id: 'base-5', name: '5-1/4 in primed baseboard, 16 ft', width: 5.25, thickness: 0.5625, length: 192, priceCents: 2600 },
        { id: 'cap-rail', name: 'Cap rail, 8 ft', width: 1.5, thickness: 1.125, length: 96, priceCents: 1300 },
        { id: 'frame-moulding', name: 'Panel moulding, 8 ft', width: 1.25, thickness: 0.5, length: 96, priceCents: 700 },
        { id: 'back-band', name: 'Back band, 8 ft', width: 1.0625, thickness: 1.0625, length: 96, priceCents: 900 },
        { id: 'corner-in', name: 'Inside corner moulding, 8 ft', width: 0.75, thickness: 0.75, length: 96, priceCents: 500 },
        { id: 'corner-out', name: 'Outside corner moulding, 8 ft', width: 1.125, thickness: 1.125, length: 96, priceCents: 700 },
      ],
      baseboardId: 'base-5',
      capRailId: 'cap-rail',
      skirtBoardId: 'pine-1x6-16',
      casing: { width: 2.25, thickness: 0.6875 }, // demo values, the common stock casing (docs/sources.md §30)
      backBandId: 'back-band',
      stoolProjection: 1.5, // the usual stool, from memory (docs/sources.md §51)
      insideCornerTrimId: 'corner-in',
      outsideCornerTrimId: 'corner-out',
      supplies: {
        brads: {
          name: '18-gauge brads, box of 1000',
          perBox: 1000,
          perSqFt: 2.5,
          perFootOfTrim: 1.5,
          priceCents: 900,
          sizes: [
            { name: '18-gauge brads, 1 in, box of 1000', length: 1, perBox: 1000, priceCents: 700 },
            { name: '18-gauge brads, 1-1/4 in, box of 1000', length: 1.25, perBox: 1000, priceCents: 750 },
            { name: '18-gauge brads, 2 in, box of 1000', length: 2, perBox: 1000, priceCents: 900 },
            { name: '18-gauge brads, 2-1/8 in, box of 1000', length: 2.125, perBox: 1000, priceCents: 950 },
            { name: '16-gauge finish nails, 2-1/2 in, box of 1000', length: 2.5, perBox: 1000, priceCents: 1100 },
          ],
        },
        adhesive: { name: 'Construction adhesive, 10 fl oz', fluidOunces: 10, bead: 0.25, feetPerSqFt: 0.5, priceCents: 650 },
        caulk: { name: 'Paintable acrylic caulk, 10.1 fl oz', fluidOunces: 10.1, bead: 0.25, priceCents: 450 },
        filler: { name: 'Wood filler, small tub', sqFtPerUnit: 150, priceCents: 800 },
        // Container sizes and prices: invented demo figures.
        primer: {
          name: 'Stain-blocking primer',
          sqFtPerGallon: 400,
          coats: 1,
          priceCents: 3500,
          containers: [
            { name: 'quart', gallons: 0.25, priceCents: 1400 },
            { name: 'gallon', gallons: 1, priceCents: 3500 },
            { name: '5-gallon pail', gallons: 5, priceCents: 15500 },
          ],
        },
        paint: {
          name: 'Interior trim enamel, eggshell',
          sqFtPerGallon: 350,
          coats: 2,
          priceCents: 5200,
          containers: [
            { name: 'quart', gallons: 0.25, priceCents: 1800 },
            { name: 'gallon', gallons: 1, priceCents: 5200 },
            { name: '5-gallon pail', gallons: 5, priceCents: 23500 },
          ],
        },
        boxExtender: { name: 'Listed box extender', priceCents: 450 },
      },
      treatments: [
        {
          id: 'shiplap-vertical-ply',
          kind: 'shiplap',
          name: 'Vertical shiplap (plywood strips)',
          enabled: true,
          sqFtPerHour: 18,
          needsPrimer: true,
          paintFactor: 1.3, // demo value; grooves and edges paint slower than flat faces (common practice, no source)
          orientation: 'vertical',
          source: { from: 'sheet', sheetId: 'ply-4x8-quarter', stripWidth: 5.875 },
          gap: 0.125,
          dampRoomTreatmentId: 'shiplap-vertical-mr',
        },
        {
          id: 'shiplap-horizontal',
          kind: 'shiplap',
          name: 'Horizontal shiplap (milled boards)',
          enabled: true,
          sqFtPerHour: 15,
          needsPrimer: true,
          paintFactor: 1.3, // demo value; grooves and edges paint slower than flat faces (common practice, no source)
          orientation: 'horizontal',
          source: { from: 'boards', boardId: 'shiplap-1x6-8' },
          gap: 0.125,
        },
        {
          id: 'board-and-batten',
          kind: 'board-and-batten',
          name: 'Board and batten',
          enabled: true,
          sqFtPerHour: 14,
          needsPrimer: false,
          paintFactor: 1.2, // demo value; grooves and edges paint slower than flat faces (common practice, no source)
          battenId: 'mdf-1x3-8',
          battenSpacing: 16,
          topRailId: 'mdf-1x4-8',
          backingSheetId: 'mdf-4x8-quarter',
        },
        {
          id: 'beadboard',
          kind: 'beadboard',
          name: 'Beadboard wainscot',
          enabled: true,
          sqFtPerHour: 20,
          needsPrimer: true,
          paintFactor: 1.5, // demo value; grooves and edges paint slower than flat faces (common practice, no source)
          sheetId: 'beadboard-4x8',
        },
        {
          id: 'flat-panel',
          kind: 'flat-panel',
          name: 'Flat-panel wainscot',
          enabled: true,
          sqFtPerHour: 10,
          needsPrimer: false,
          paintFactor: 1, // demo value; grooves and edges paint slower than flat faces (common practice, no source)
          stileId: 'mdf-1x4-8',
          railId: 'mdf-1x4-8',
          stileSpacing: 24,
          backingSheetId: 'mdf-4x8-quarter',
        },
        {
          id: 'picture-frame',
          kind: 'picture-frame',
          name: 'Picture-frame moulding',
          enabled: true,
          sqFtPerHour: 12,
          needsPrimer: true,
          paintFactor: 1.2, // demo value; grooves and edges paint slower than flat faces (common practice, no source)
          mouldingId: 'frame-moulding',
          margin: 4,
          frameGap: 4,
          targetFrameWidth: 30,
          fullHeightRows: 2,
        },
        {
          // Offered only in damp rooms, in place of the plywood strips.
          id: 'shiplap-vertical-mr',
          kind: 'shiplap',
          name: 'Vertical shiplap (moisture-resistant MDF strips)',
          enabled: false,
          sqFtPerHour: 16,
          needsPrimer: true,
          paintFactor: 1.3, // demo value, as above
          orientation: 'vertical',
          source: { from: 'sheet', sheetId: 'mr-mdf-4x8-half', stripWidth: 5.875 },
          gap: 0.125,
        },
      ],
    },
    materialMarkup: 0.25,
    labour: {
      rateCents: 7500,
      hoursPerCutOut: 0.25,
      hoursPerReturn: 0.5,
      hoursPerCorner: 0.2,
      hoursPerFootBaseboardRemoved: 0.02,
      hoursPerFootBaseboardInstalled: 0.05,
      hoursPerFootCapRail: 0.06,
      hoursPerFootBackBand: 0.05, // demo value
      hoursPerRakeCut: 0.1, // demo value
      hoursPerStoolRefit: 1.5, // demo value
      paintSqFtPerHour: 80,
      setupHoursPerVisit: 1,
      hoursPerDay: 8,
      hoursPerFixture: { tub: 0.5, shower: 0.5, vanity: 1, 'built-in': 1, toilet: 1.5, radiator: 2 },
    },
    extras: {
      leadSafe: { perJobCents: 25000, perRoomCents: 15000, everyPre1978Job: false },
      highCeiling: { aboveHeight: 108, perRoomCents: 20000 },
      tripZones: [
        { id: 'local', name: 'Within 15 miles', feeCents: 0 },
        { id: 'outer', name: '15 to 40 miles', feeCents: 7500 },
      ],
    },
    taxRate: 0.07,
    taxOn: 'materials',
    minimumJobCents: 95000,
    roundingCents: 5000,
    range: {
      'homeowner-estimate': { withPhotos: { below: 0.15, above: 0.3 }, withoutPhotos: { below: 0.2, above: 0.4 } },
      'homeowner-tape': { withPhotos: { below: 0.1, above: 0.15 }, withoutPhotos: { below: 0.12, above: 0.22 } },
      'site-measure': { withPhotos: { below: 0.03, above: 0.05 }, withoutPhotos: { below: 0.04, above: 0.06 } },
    },
  };
}

/** An invented two-room project: a dining room wainscot and a bedroom accent wall. */
export function sampleProject(): ProjectInput {
  return {
    rooms: [
      {
        name: 'Dining room',
        ceilingHeight: 96,
        length: 156,
        width: 132,
        walls: [
          { label: 'Window wall', side: 'length', openings: [{ kind: 'window', width: 36, height: 56, sillHeight: 24, offset: 60 }], outlets: 2 },
          { label: 'Hall wall', side: 'width', openings: [{ kind: 'door', width: 32, height: 80, sillHeight: 0, offset: 12 }], outlets: 1, switches: 1 },
          { label: 'Sideboard wall', side: 'length', outlets: 2 },
          { label: 'Kitchen wall', side: 'width', openings: [{ kind: 'door' }], outlets: 1 },
        ],
        treatment: { id: 'board-and-batten', height: 'wainscot', wainscotHeight: 36 },
        replaceBaseboard: true,
      },
      {
        name: 'Main bedroom',
        ceilingHeight: 96,
        walls: [{ label: 'Bed wall', length: 150, outlets: 2 }],
        treatment: { id: 'shiplap-vertical-ply', height: 'full' },
      },
    ],
    paint: true,
    builtBefore1978: 'not-sure',
    measuredBy: 'homeowner-tape',
    photoCount: 3,
    tripZone: 'local',
  };
}
