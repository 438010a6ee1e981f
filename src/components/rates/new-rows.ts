/**
 * A fresh row for each list of the Rate book editor, in the form's values. Numbers start empty, so
 * the owner types each one (the schema names any left out); yes/no fields start at the schema's
 * default; a finish starts with the kind chosen for it.
 */
import type { TreatmentKind } from '~/lib/estimate';
import { patternOf } from '~/lib/shared/rate-book-fields';

export function newTreatment(kind: TreatmentKind): Record<string, unknown> {
  const common = { kind, id: '', name: '', enabled: true, needsPrimer: true, layout: 'from-left' };
  if (kind === 'shiplap') return { ...common, orientation: 'vertical', source: { from: 'boards', boardId: '' } };
  return common;
}

/** A blank row for the list at `path` (a concrete path: rows of nested lists are under their row). */
export function newRow(path: string): Record<string, unknown> {
  switch (patternOf(path)) {
    case 'catalogue.sheets':
    case 'catalogue.boards':
      return { id: '', name: '', moistureResistant: false };
    case 'catalogue.mouldings':
      return { id: '', name: '', longerLengths: [] };
    case 'catalogue.treatments':
      return newTreatment('shiplap');
    case 'extras.tripZones':
      return { id: '', name: '' };
    default:
      // Longer lengths, brad sizes and containers: names and numbers only.
      return { name: '' };
  }
}
