import useSWR, { mutate } from 'swr';
import { timelineUrl, type TimelineView } from '~/lib/shared/inquiry-timeline';

/** A refused request: the server's message and its field messages (`{"error","fields"}`). */
export class RequestFailed extends Error {
  constructor(
    message: string,
    readonly status: number,
    readonly fields: Record<string, string> = {},
  ) {
    super(message);
  }
}

const UNREACHABLE = 'We could not reach the server. Check your connection, then try again.';

/** What the server answered beside the status: `{"error","fields"}` and whatever else a route adds. */
export type RefusalBody = { error?: string; fields?: Record<string, string>; [more: string]: unknown };

/** Turns a refusal into the error a caller throws (status 0 with an empty body: the server was not reached). */
export type RefusalToError = (message: string, status: number, body: RefusalBody) => Error;

const asRequestFailedError: RefusalToError = (message, status, body) => new RequestFailed(message, status, body.fields);

/** One JSON request of the staff islands; a refusal becomes `refused(...)` (by default a `RequestFailed`). */
export async function callJson<T>(method: string, url: string, body?: unknown, refused: RefusalToError = asRequestFailedError): Promise<T> {
  let response: Response;
  try {
    response = await fetch(url, {
      method,
      headers: body === undefined ? {} : { 'content-type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
      credentials: 'same-origin',
    });
  } catch (error) {
    if (error instanceof TypeError) throw refused(UNREACHABLE, 0, {});
    throw error;
  }
  if (response.status === 204) return undefined as T;
  const answer = (await response.json().catch((error: unknown) => {
    if (error instanceof SyntaxError) return {};
    throw error;
  })) as RefusalBody;
  if (!response.ok) throw refused(answer.error ?? 'Something went wrong on our side. Please try again.', response.status, answer);
  return answer as T;
}

const call = <T>(method: string, url: string, body?: unknown) => callJson<T>(method, url, body);

export const getJson = <T>(url: string) => call<T>('GET', url);
export const sendJson = <T>(method: 'POST' | 'PUT' | 'PATCH' | 'DELETE', url: string, body?: unknown) => call<T>(method, url, body);

/**
 * The inquiry's timeline and workflow state, shared by the page's islands through SWR's cache:
 * after any action the answer is put in the cache, and every island showing it re-renders.
 */
export function useInquiryTimeline(leadId: string, initial: TimelineView) {
  return useSWR<TimelineView>(timelineUrl(leadId), getJson, { fallbackData: initial, revalidateOnFocus: true });
}

/** Sends a workflow action; its answer (the refreshed timeline) replaces the cached one. */
export async function act(leadId: string, method: 'POST' | 'PUT', url: string, body?: unknown): Promise<TimelineView> {
  const view = await sendJson<TimelineView>(method, url, body);
  await mutate(timelineUrl(leadId), view, { revalidate: false });
  return view;
}

/** After a change made elsewhere on the page (a call, a note, an e-mail), the timeline loads again. */
export function announceLeadChanged(leadId: string): void {
  void mutate(timelineUrl(leadId));
}

/** Any failure of a staff form's request, as the refusal it shows (a bug's message, status 0). */
export function asRequestFailed(error: unknown): RequestFailed {
  return error instanceof RequestFailed ? error : new RequestFailed(String(error), 0);
}

/** What a staff form says after its last send: done, or failed with the server's message. */
export type FormStatus = { kind: 'done' | 'failed'; text: string } | null;
