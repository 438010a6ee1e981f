/**
 * Damp rooms get damp-rated material. Standard MDF and raw plywood swell and delaminate where
 * bathroom humidity reaches them (docs/sources.md §10), so in a room marked damp the takeoff prices the
 * alternative the firm names for the chosen finish: another treatment of the same kind, made with
 * moisture-resistant stock. Only when the firm names none does the estimate fall back to cautioning.
 */
import type { Catalogue, Room, Treatment } from './schemas.ts';

export interface TreatmentChoice {
  /** The treatment the room is priced with. */
  treatment: Treatment;
  /** The one the homeowner chose, when a damp-room alternative replaced it. */
  replaced?: Treatment;
}

export function treatmentForRoom(room: Pick<Room, 'treatment' | 'damp'>, catalogue: Catalogue): TreatmentChoice {
  const chosen = catalogue.treatments.find((x) => x.id === room.treatment.id)!;
  if (!room.damp || chosen.dampRoomTreatmentId === undefined) return { treatment: chosen };
  const alt = catalogue.treatments.find((x) => x.id === chosen.dampRoomTreatmentId && x.kind === chosen.kind);
  return alt ? { treatment: alt, replaced: chosen } : { treatment: chosen };
}
