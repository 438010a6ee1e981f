/**
 * The opaque cursor of a keyset page: the sort it belongs to and the last row's sort key and id.
 * The next page starts strictly after that pair, so paging needs no OFFSET and a row inserted
 * meanwhile never shifts a page. A cursor from another sort (or made up) is refused.
 */
import { isId } from '~/lib/shared/ids';

export type ListCursor = { sort: string; dir: 'asc' | 'desc'; key: string; id: string };

export function encodeCursor(cursor: ListCursor): string {
  return Buffer.from(JSON.stringify([cursor.sort, cursor.dir, cursor.key, cursor.id]), 'utf8').toString('base64url');
}

/** The cursor, or null when the text is not one of ours. */
export function decodeCursor(text: string): ListCursor | null {
  if (!/^[A-Za-z0-9_-]{1,400}$/.test(text)) return null;
  let value: unknown;
  try {
    value = JSON.parse(Buffer.from(text, 'base64url').toString('utf8'));
  } catch (error) {
    if (error instanceof SyntaxError) return null;
    throw error;
  }
  if (!Array.isArray(value) || value.length !== 4) return null;
  const [sort, dir, key, id] = value as unknown[];
  if (typeof sort !== 'string' || (dir !== 'asc' && dir !== 'desc') || typeof key !== 'string' || key.length > 200 || !isId(id)) return null;
  return { sort, dir, key, id };
}
