/**
 * The problems of a Rate book form in one list, for the summary beside Save: the form is long, so a
 * message deep in the finishes would otherwise go unseen. Each names its field and where it is.
 */
import type { FieldErrors } from 'react-hook-form';
import { fieldAt, listAt } from '~/lib/shared/rate-book-fields';

export type Problem = { path: string; where: string; message: string };

/** `catalogue.sheets.1.priceCents` → "Sheet 2 · Sheet price". */
export function whereIs(path: string): string {
  const parts = path.split('.');
  const words: string[] = [];
  for (let i = 0; i < parts.length; i++) {
    if (!/^\d+$/.test(parts[i]!)) continue;
    const list = listAt(parts.slice(0, i));
    if (list) words.push(`${list.itemLabel.charAt(0).toUpperCase()}${list.itemLabel.slice(1)} ${Number(parts[i]) + 1}`);
  }
  const field = fieldAt(path);
  const list = listAt(path.replace(/\.root$/, ''));
  words.push(field?.label ?? list?.label ?? 'Rate book');
  return words.join(' · ');
}

/** Every message in react-hook-form's nested errors, as paths in screen order (the form's order). */
export function problemsOf(errors: FieldErrors): Problem[] {
  const out: Problem[] = [];
  const walk = (node: unknown, path: string[]): void => {
    if (node === null || typeof node !== 'object') return;
    const message = (node as { message?: unknown }).message;
    if (typeof message === 'string' && message !== '' && 'type' in node) {
      const at = path.join('.');
      out.push({ path: at, where: whereIs(at), message });
      return;
    }
    for (const [key, inner] of Object.entries(node)) if (key !== 'ref') walk(inner, [...path, key]);
  };
  walk(errors, []);
  return out;
}

/** The concrete list path a `….root` message is about, for its link. */
export const pathOfProblem = (path: string) => (path.endsWith('.root') ? path.slice(0, -'.root'.length) : path);
