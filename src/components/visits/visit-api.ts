/**
 * The Visits islands' requests. A refused booking or move (409) carries the next open times, which
 * the dialogs offer to pick from.
 */
import type { SlotView } from '~/lib/shared/visit-schemas';
import { RequestFailed } from '~/components/inquiries/page/api';

export class VisitRequestFailed extends RequestFailed {
  constructor(
    message: string,
    status: number,
    fields: Record<string, string>,
    /** The next open times, when the time asked for was taken or not open. */
    readonly alternatives: SlotView[],
  ) {
    super(message, status, fields);
  }
}

const UNREACHABLE = 'We could not reach the server. Check your connection, then try again.';

export async function visitRequest<T>(method: 'GET' | 'POST' | 'PUT', url: string, body?: unknown): Promise<T> {
  let response: Response;
  try {
    response = await fetch(url, {
      method,
      headers: body === undefined ? {} : { 'content-type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
      credentials: 'same-origin',
    });
  } catch (error) {
    if (error instanceof TypeError) throw new VisitRequestFailed(UNREACHABLE, 0, {}, []);
    throw error;
  }
  const answer = (await response.json().catch((error: unknown) => {
    if (error instanceof SyntaxError) return {};
    throw error;
  })) as { error?: string; fields?: Record<string, string>; alternatives?: SlotView[] };
  if (!response.ok) {
    throw new VisitRequestFailed(
      answer.error ?? 'Something went wrong on our side. Please try again.',
      response.status,
      answer.fields ?? {},
      answer.alternatives ?? [],
    );
  }
  return answer as T;
}

export const getVisitJson = <T>(url: string) => visitRequest<T>('GET', url);

export function slotsUrl(salespersonId: string | null | undefined): string {
  return salespersonId ? `/api/app/visits/slots?salespersonId=${encodeURIComponent(salespersonId)}` : '/api/app/visits/slots';
}

/** A refusal as a failed request, whatever was thrown (a bug's message, status 0). */
export function asVisitFailure(error: unknown): VisitRequestFailed {
  if (error instanceof VisitRequestFailed) return error;
  if (error instanceof RequestFailed) return new VisitRequestFailed(error.message, error.status, error.fields, []);
  return new VisitRequestFailed(String(error), 0, {}, []);
}
