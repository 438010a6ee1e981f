/**
 * The list's view as the address bar holds it. Reading is lenient (a hand-edited or old bookmark
 * keeps what still makes sense); writing is canonical (`viewSearchParams`), so the same view gives
 * the same address, API call and `?in=` link.
 */
import { VIEW_PARAMS, inquiryListQuerySchema, viewSearchParams } from '~/lib/shared/inquiry-list';

export type View = Partial<Record<(typeof VIEW_PARAMS)[number], string>>;

export function viewFromParams(params: URLSearchParams): View {
  const view: View = {};
  for (const name of VIEW_PARAMS) {
    const value = params.get(name);
    if (value === null || value === '') continue;
    // Keep a parameter only if the shared schema accepts it on its own.
    if (inquiryListQuerySchema.safeParse({ [name]: value }).success) view[name] = value;
  }
  return view;
}

export function viewQueryString(view: View): string {
  return viewSearchParams(view).toString();
}

/** How long someone has waited, short: "45 min", "3 h", "2 d" (whole units, rounded down). */
export function waitingText(sinceIso: string, nowMs: number): string {
  const minutes = Math.max(0, Math.floor((nowMs - Date.parse(sinceIso)) / 60_000));
  if (minutes < 60) return `${minutes} min`;
  const hours = Math.floor(minutes / 60);
  if (hours < 48) return `${hours} h`;
  return `${Math.floor(hours / 24)} d`;
}
