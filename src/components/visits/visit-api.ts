/**
 * The Visits islands' requests. A refused booking or move (409) carries the next open times, which
 * the dialogs offer to pick from.
 */
import type { SlotView } from '~/lib/shared/visit-schemas';
import { callJson, RequestFailed } from '~/components/inquiries/page/api';

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

export function visitRequest<T>(method: 'GET' | 'POST' | 'PUT', url: string, body?: unknown): Promise<T> {
  return callJson<T>(
    method,
    url,
    body,
    (message, status, answer) => new VisitRequestFailed(message, status, answer.fields ?? {}, (answer.alternatives as SlotView[] | undefined) ?? []),
  );
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
