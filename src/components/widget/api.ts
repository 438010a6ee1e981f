import type { ProjectInput } from '~/lib/estimate/index.ts';
import type { HomeownerEstimate } from '~/lib/shared/homeowner-estimate';
import type { ContactInput } from '~/lib/shared/lead-schemas';
import type { InquiryProof, PublicSlot, WidgetSlotsAnswer, WidgetVisitAnswer } from '~/lib/shared/widget-visit-schemas';

/** Why a request failed: what the homeowner can do about it differs for each. */
export type FailureKind = 'timeout' | 'network' | 'server' | 'input';

export class ApiError extends Error {
  constructor(
    message: string,
    readonly status: number,
    readonly fields: Record<string, string> = {},
    readonly kind: FailureKind = status === 0 ? 'network' : status >= 500 ? 'server' : 'input',
    /** The rest of the error answer (a 409's `alternatives`, say). */
    readonly body: Record<string, unknown> = {},
  ) {
    super(message);
  }

  /** Whether asking again, unchanged, may succeed (a slow or failing server, a dropped connection, a busy limiter). */
  get retryable(): boolean {
    return this.kind !== 'input' || this.status === 429;
  }
}

export const ESTIMATE_TIMEOUT_MS = 8000;
export const SEND_TIMEOUT_MS = 20_000;
/** A short pause before the automatic retry, so a server that just restarted has a moment. */
const RETRY_PAUSE_MS = 400;

const TOO_SLOW = 'The server is taking too long to answer. Check your connection, then try again.';
const UNREACHABLE = 'We could not reach the server. Check your connection, then try again.';
const SERVER_FAILED = 'Something went wrong on our side. Please try again in a moment.';

export type PostOptions = {
  /** The whole request, its retry included, ends with an answer or an error within this time. */
  timeoutMs: number;
  /** Automatic retries on a network failure or a 5xx; never on a 4xx. */
  retries: number;
  fetchImpl?: typeof fetch;
};

const pause = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

export function postJson<T>(url: string, body: unknown, options: PostOptions): Promise<T> {
  return requestJson<T>('POST', url, body, options);
}

/** A GET with the same time limit, retries and error handling as `postJson`. */
export function getJson<T>(url: string, options: PostOptions): Promise<T> {
  return requestJson<T>('GET', url, undefined, options);
}

async function requestJson<T>(method: 'GET' | 'POST', url: string, body: unknown, { timeoutMs, retries, fetchImpl = fetch }: PostOptions): Promise<T> {
  // One deadline for every attempt: a retry never restarts the clock the homeowner is watching.
  const controller = new AbortController();
  const timer = setTimeout(() => controller.abort(), timeoutMs);
  const timedOut = new Promise<never>((_, reject) => controller.signal.addEventListener('abort', () => reject(new ApiError(TOO_SLOW, 0, {}, 'timeout'))));
  timedOut.catch(() => undefined);
  try {
    for (let attempt = 0; ; attempt++) {
      try {
        return await Promise.race([once<T>(fetchImpl, method, url, body, controller.signal), timedOut]);
      } catch (error) {
        const failure = error instanceof ApiError ? error : new ApiError(SERVER_FAILED, 0);
        if (controller.signal.aborted) throw new ApiError(TOO_SLOW, 0, {}, 'timeout');
        if (attempt >= retries || failure.kind === 'input') throw failure;
        await Promise.race([pause(RETRY_PAUSE_MS), timedOut]);
      }
    }
  } finally {
    clearTimeout(timer);
  }
}

async function once<T>(fetchImpl: typeof fetch, method: 'GET' | 'POST', url: string, body: unknown, signal: AbortSignal): Promise<T> {
  let response: Response;
  try {
    response = await fetchImpl(
      url,
      method === 'GET' ? { method, signal } : { method, headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(body), signal },
    );
  } catch {
    throw new ApiError(UNREACHABLE, 0);
  }
  const data = await response.json().catch(() => ({}));
  if (!response.ok) {
    const fallback = response.status >= 500 ? SERVER_FAILED : 'Something went wrong. Please try again.';
    throw new ApiError(typeof data.error === 'string' ? data.error : fallback, response.status, data.fields ?? {}, undefined, data);
  }
  return data as T;
}

export function fetchEstimate(slug: string, formToken: string, project: ProjectInput): Promise<HomeownerEstimate> {
  return postJson<{ estimate: HomeownerEstimate }>(`/api/embed/${slug}/estimate`, { formToken, project }, { timeoutMs: ESTIMATE_TIMEOUT_MS, retries: 1 }).then(
    (d) => d.estimate,
  );
}

export type SentLead = { lead: { reference: string; viewUrl: string | null }; estimate: HomeownerEstimate | null };

/** No automatic retry: the homeowner presses Send again (the idempotency key keeps that to one inquiry). */
export function sendLead(
  slug: string,
  body: { formToken: string; idempotencyKey: string; project: ProjectInput; contact: ContactInput; website?: string },
): Promise<SentLead> {
  return postJson<SentLead>(`/api/embed/${slug}/leads`, body, { timeoutMs: SEND_TIMEOUT_MS, retries: 0 });
}

export const SLOTS_TIMEOUT_MS = 8000;
export const BOOK_TIMEOUT_MS = 20_000;

/** The open visit times for the inquiry just sent (the assignee's, or the team's). */
export function fetchVisitSlots(slug: string, proof: InquiryProof): Promise<WidgetSlotsAnswer> {
  const query = new URLSearchParams({ lead: proof.lead, key: proof.key });
  return getJson<WidgetSlotsAnswer>(`/api/embed/${slug}/slots?${query}`, { timeoutMs: SLOTS_TIMEOUT_MS, retries: 1 });
}

/**
 * No automatic retry: a booking that reached the server before the connection dropped is kept, so
 * the homeowner decides to press Book again (and is then told the inquiry already has its visit).
 */
export function bookVisitTime(slug: string, body: InquiryProof & { start: string; note?: string }): Promise<WidgetVisitAnswer> {
  return postJson<WidgetVisitAnswer>(`/api/embed/${slug}/visits`, body, { timeoutMs: BOOK_TIMEOUT_MS, retries: 0 });
}

/** The next open times a 409 offered instead (none when it offered none). */
export function alternativesOf(error: ApiError): PublicSlot[] {
  const offered = error.body.alternatives;
  return Array.isArray(offered) ? offered.filter((s): s is PublicSlot => typeof s?.start === 'string' && typeof s?.end === 'string') : [];
}
