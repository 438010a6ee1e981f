/**
 * The widget's calls to its photo endpoints. Each answer is either the data, a refusal to show
 * the homeowner (the file or form will not do), or a failure worth retrying (network, busy server).
 */
import type { UploadTarget } from './upload-with-progress';

/** `status` is 0 when the server was not reached. */
export type ApiAnswer<T> = { ok: true; data: T } | { ok: false; retry: boolean; message: string; status: number };

export const OFFLINE_MESSAGE = 'The connection dropped. Check your signal and try again.';
const SERVER_TROUBLE = 'Something went wrong on our side. Please try again.';

async function call<T>(method: 'POST' | 'DELETE', url: string, body: unknown): Promise<ApiAnswer<T>> {
  let response: Response;
  try {
    response = await fetch(url, { method, headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(body) });
  } catch {
    return { ok: false, retry: true, message: OFFLINE_MESSAGE, status: 0 };
  }
  if (response.status === 204) return { ok: true, data: undefined as T };
  const data = (await response.json().catch(() => ({}))) as { error?: string; fields?: Record<string, string> } & T;
  if (response.ok) return { ok: true, data };
  // A message for a field is the specific one ("over 15 MB"); the top-level one may be generic.
  const specific = data.fields ? Object.values(data.fields)[0] : undefined;
  const message = specific ?? data.error ?? SERVER_TROUBLE;
  const retry = response.status === 429 || response.status >= 500;
  return { ok: false, retry, message: response.status >= 500 ? SERVER_TROUBLE : message, status: response.status };
}

const base = (slug: string) => `/api/embed/${encodeURIComponent(slug)}/photos`;

export function requestUpload(slug: string, formToken: string, file: { name: string; size: number; type: string }) {
  return call<{ photo: { id: string }; upload: UploadTarget }>('POST', base(slug), { formToken, ...file });
}

export function completeUpload(slug: string, formToken: string, photoId: string) {
  return call<{ photo: { id: string; width: number; height: number; thumbnailUrl: string } }>('POST', `${base(slug)}/${photoId}/complete`, { formToken });
}

export function removeUpload(slug: string, formToken: string, photoId: string) {
  return call<undefined>('DELETE', `${base(slug)}/${photoId}`, { formToken });
}
