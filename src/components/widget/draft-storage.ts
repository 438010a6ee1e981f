/**
 * Keeps the homeowner's answers in the browser tab (sessionStorage), so a reload, or a phone
 * camera that reloads the tab, loses nothing. One entry per firm; cleared after Send.
 *
 * sessionStorage rather than localStorage: it survives a reload of the tab but not the tab itself,
 * so a shared computer does not keep a stranger's house plan. The draft is stored whole and checked
 * loosely (version and outline), so its fields can change without breaking this file.
 */
import type { Units } from '~/lib/estimate/units.ts';

// 2: rooms carry their own walls, items and finish.
export const DRAFT_STORAGE_VERSION = 2;

export type SavedPhoto = { id: string; name: string; thumbnailUrl: string };

export type SavedWidget = {
  slug: string;
  units: Units;
  /** The token the draft's photos were uploaded under. */
  formToken: string;
  step: number;
  /** The widget's draft as it was (its exact shape belongs to draft.ts). */
  draft: { rooms: unknown[] } & Record<string, unknown>;
  photos: SavedPhoto[];
  /** The Send key of this visit: a send whose answer was lost before a reload is not made twice. */
  idempotencyKey?: string;
};

type Stored = SavedWidget & { version: number; savedAt: number };

export const draftStorageKey = (slug: string): string => `lapwing:price-widget:${slug}`;

/** The tab's storage, or null where a browser blocks it in a third-party frame (reading it can throw). */
export function tabStorage(): Storage | null {
  try {
    return typeof window === 'undefined' ? null : window.sessionStorage;
  } catch {
    return null;
  }
}

export function saveDraft(storage: Storage | null, saved: SavedWidget, now = Date.now()): void {
  if (!storage) return;
  const entry: Stored = { version: DRAFT_STORAGE_VERSION, savedAt: now, ...saved };
  try {
    storage.setItem(draftStorageKey(saved.slug), JSON.stringify(entry));
  } catch {
    // Full or blocked: the widget still works, it just will not survive a reload.
  }
}

export function clearDraft(storage: Storage | null, slug: string): void {
  try {
    storage?.removeItem(draftStorageKey(slug));
  } catch {
    // Nothing to do: a blocked store holds nothing of ours.
  }
}

const isObject = (x: unknown): x is Record<string, unknown> => typeof x === 'object' && x !== null && !Array.isArray(x);
const isPhoto = (x: unknown): x is SavedPhoto => isObject(x) && typeof x.id === 'string' && typeof x.name === 'string' && typeof x.thumbnailUrl === 'string';

/** The saved widget for this firm and units, or null when there is none or it does not look like one. */
export function loadDraft(storage: Storage | null, slug: string, units: Units): SavedWidget | null {
  let raw: string | null = null;
  try {
    raw = storage?.getItem(draftStorageKey(slug)) ?? null;
  } catch {
    return null;
  }
  if (!raw) return null;
  let data: unknown;
  try {
    data = JSON.parse(raw);
  } catch {
    return null;
  }
  if (!isObject(data) || data.version !== DRAFT_STORAGE_VERSION || data.slug !== slug || data.units !== units) return null;
  if (typeof data.formToken !== 'string' || typeof data.step !== 'number' || !Number.isInteger(data.step)) return null;
  const draft = data.draft;
  if (!isObject(draft) || !Array.isArray(draft.rooms) || draft.rooms.length === 0 || !draft.rooms.every(isObject)) return null;
  const photos = Array.isArray(data.photos) ? data.photos.filter(isPhoto) : [];
  const idempotencyKey = typeof data.idempotencyKey === 'string' ? { idempotencyKey: data.idempotencyKey } : {};
  return { slug, units, formToken: data.formToken, step: data.step, draft: draft as SavedWidget['draft'], photos, ...idempotencyKey };
}

/** When a form token was issued (its payload is readable; only the server can check its signature). */
export function formTokenIssuedAt(token: string): number | null {
  const payload = token.split('.')[0];
  if (!payload || !/^[A-Za-z0-9_-]+$/.test(payload)) return null;
  try {
    const text = atob(payload.replace(/-/g, '+').replace(/_/g, '/'));
    const data: unknown = JSON.parse(text);
    return isObject(data) && typeof data.t === 'number' ? data.t : null;
  } catch {
    return null;
  }
}

/** Keep the saved token only if it has this long left: enough to finish the form and send it. */
const TIME_LEFT_TO_FINISH_MS = 60 * 60 * 1000;

/**
 * The token a restored draft goes on with. The saved one keeps the photos uploaded under it (and
 * the time the form was first opened); a reload's new one is used when the saved one is too old.
 */
export function chooseFormToken(saved: string | null, fresh: string, ttlMs: number, now = Date.now()): { formToken: string; kept: boolean } {
  const issuedAt = saved ? formTokenIssuedAt(saved) : null;
  if (saved && issuedAt !== null && issuedAt <= now && now - issuedAt < ttlMs - TIME_LEFT_TO_FINISH_MS) return { formToken: saved, kept: true };
  return { formToken: fresh, kept: false };
}

/**
 * A copy with every `key` property given a new value: list keys are made by a counter that
 * restarts with the page, so restored keys could clash with ones made after the reload.
 */
export function rekey<T>(value: T, newKey: () => string): T {
  if (Array.isArray(value)) return value.map((item) => rekey(item, newKey)) as T;
  if (!isObject(value)) return value;
  const out: Record<string, unknown> = {};
  if (typeof value.key === 'string') out.key = newKey();
  for (const [name, item] of Object.entries(value)) if (!(name === 'key' && typeof item === 'string')) out[name] = rekey(item, newKey);
  return out as T;
}
