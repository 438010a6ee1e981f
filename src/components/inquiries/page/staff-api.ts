/**
 * Calls from the inquiry page's islands to the staff routes (same origin, so the session cookie
 * and the CSRF check's Origin come along). A refusal comes back with the server's message and its
 * field messages, for the island to show beside each field.
 */
export class StaffApiError extends Error {
  constructor(
    message: string,
    readonly status: number,
    readonly fields: Record<string, string> = {},
  ) {
    super(message);
  }
}

const UNREACHABLE = 'We could not reach the server. Check your connection, then try again.';

export async function sendJson<T>(method: 'POST' | 'PATCH' | 'DELETE', url: string, body?: unknown): Promise<T> {
  let response: Response;
  try {
    response = await fetch(url, {
      method,
      headers: body === undefined ? {} : { 'content-type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
      credentials: 'same-origin',
    });
  } catch {
    throw new StaffApiError(UNREACHABLE, 0);
  }
  if (response.status === 204) return undefined as T;
  const answer = (await response.json().catch(() => ({}))) as { error?: string; fields?: Record<string, string> };
  if (!response.ok) throw new StaffApiError(answer.error ?? 'Something went wrong on our side. Please try again.', response.status, answer.fields ?? {});
  return answer as T;
}

export async function getJson<T>(url: string): Promise<T> {
  const response = await fetch(url, { credentials: 'same-origin' });
  if (!response.ok) throw new StaffApiError('Could not load this.', response.status);
  return (await response.json()) as T;
}

/** Tells the rest of the page (the timeline) that the inquiry changed, so it can load its entries again. */
export function announceLeadChanged(leadId: string): void {
  window.dispatchEvent(new CustomEvent('lapwing:lead-changed', { detail: { leadId } }));
}
