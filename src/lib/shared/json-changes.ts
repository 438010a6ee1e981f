/**
 * Where two JSON values differ, leaf by leaf: `{ path: 'labour.rateCents', before: 6500, after: 7000 }`.
 * Paths join keys and list positions with dots, as form field names do (`catalogue.sheets.0.priceCents`);
 * a leaf only one side has shows `undefined` on the other. Used to compare Rate book versions and to
 * tell an owner what someone else changed in the draft they were editing.
 */
export type JsonChange = { path: string; before: unknown; after: unknown };

export function jsonChanges(before: unknown, after: unknown, path = ''): JsonChange[] {
  if (isBranch(before) && isBranch(after) && Array.isArray(before) === Array.isArray(after)) {
    const keys = new Set([...Object.keys(before), ...Object.keys(after)]);
    const changes: JsonChange[] = [];
    for (const key of keys) {
      changes.push(...jsonChanges((before as Record<string, unknown>)[key], (after as Record<string, unknown>)[key], path ? `${path}.${key}` : key));
    }
    return changes;
  }
  if (isBranch(before) || isBranch(after)) {
    // A list or object on one side only: every leaf under it changed.
    return [...leaves(before, path, 'before'), ...leaves(after, path, 'after')].reduce<JsonChange[]>((all, change) => {
      const same = all.find((c) => c.path === change.path);
      if (same) Object.assign(same, change.before === undefined ? { after: change.after } : { before: change.before });
      else all.push(change);
      return all;
    }, []);
  }
  return Object.is(before, after) ? [] : [{ path, before, after }];
}

function isBranch(value: unknown): value is object {
  return typeof value === 'object' && value !== null;
}

function leaves(value: unknown, path: string, side: 'before' | 'after'): JsonChange[] {
  if (value === undefined) return [];
  if (!isBranch(value)) return [side === 'before' ? { path, before: value, after: undefined } : { path, before: undefined, after: value }];
  return Object.entries(value).flatMap(([key, child]) => leaves(child, path ? `${path}.${key}` : key, side));
}
