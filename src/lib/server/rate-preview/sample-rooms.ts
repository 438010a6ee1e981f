import type { ProjectInput, RateBook } from '~/lib/estimate';

/**
 * The rooms an owner's draft is tried on: for every finish either version offers, one ordinary
 * 12 × 14 ft room with an 8 ft ceiling, a door and a window, measured with a tape and with photos.
 * A wainscot height for the panel finishes, full height for the boards (the usual accent wall).
 * Invented, like demo data: they only have to be the same on both sides of the comparison.
 */
export type SampleRoom = { treatmentId: string; treatmentName: string; description: string; project: ProjectInput };

const WAINSCOT_KINDS = new Set(['beadboard', 'flat-panel', 'picture-frame']);

export function sampleRooms(published: RateBook | null, draft: RateBook): SampleRoom[] {
  const seen = new Map<string, string>();
  for (const book of [draft, published]) {
    for (const t of book?.catalogue.treatments ?? []) if (t.enabled && !seen.has(t.id)) seen.set(t.id, t.name);
  }
  // A trip zone both versions know, so a renamed or removed zone does not look like a price change.
  const zone = draft.extras.tripZones.find((z) => !published || published.extras.tripZones.some((p) => p.id === z.id))?.id;
  return [...seen].map(([id, name]) => {
    const kind = [...draft.catalogue.treatments, ...(published?.catalogue.treatments ?? [])].find((t) => t.id === id)!.kind;
    const wainscot = WAINSCOT_KINDS.has(kind);
    return {
      treatmentId: id,
      treatmentName: name,
      description: wainscot ? '12 × 14 ft room, 36 in wainscot, one door and one window' : '12 × 14 ft room, full height, one door and one window',
      project: {
        rooms: [
          {
            name: 'Sample room',
            ceilingHeight: 96,
            length: 168,
            width: 144,
            walls: [
              { label: 'Window wall', side: 'length', openings: [{ kind: 'window', width: 36, height: 48, sillHeight: 36, offset: 66 }], outlets: 2 },
              { label: 'Door wall', side: 'width', openings: [{ kind: 'door', width: 32, height: 80, sillHeight: 0, offset: 12 }], outlets: 1, switches: 1 },
              { label: 'Long wall', side: 'length', outlets: 2 },
              { label: 'End wall', side: 'width', outlets: 1 },
            ],
            treatment: wainscot ? { id, height: 'wainscot', wainscotHeight: 36 } : { id, height: 'full' },
            replaceBaseboard: true,
          },
        ],
        paint: true,
        builtBefore1978: 'no',
        measuredBy: 'homeowner-tape',
        photoCount: 3,
        ...(zone ? { tripZone: zone } : {}),
      },
    };
  });
}
