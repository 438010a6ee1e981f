import type { LeadEventKind } from '~/lib/shared/lead-events';
import type { LeadEvent } from './lead-event.entity';

export type PresentedEvent = { id: string; kind: LeadEventKind; at: string; data: Record<string, unknown> };

/** A timeline entry as a route answers it. */
export function presentEvent(event: LeadEvent): PresentedEvent {
  return { id: event.id, kind: event.kind, at: event.at.toISOString(), data: event.data };
}
