import { useState } from 'react';
import type { TimelineView } from '~/lib/shared/inquiry-timeline';
import { act, RequestFailed, useInquiryTimeline } from './api';

type Props = { leadId: string; initial: TimelineView };

/** The inquiry's history, oldest first, with Undo on the latest stage move and assignment. */
export function InquiryTimeline({ leadId, initial }: Props) {
  const { data } = useInquiryTimeline(leadId, initial);
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState<string | null>(null);
  const events = (data ?? initial).events;

  async function undo(eventId: string) {
    setBusy(eventId);
    setProblem(null);
    try {
      await act(leadId, 'POST', `/api/app/leads/${leadId}/events/${eventId}/undo`);
    } catch (error) {
      if (!(error instanceof RequestFailed)) throw error;
      setProblem(error.message);
    } finally {
      setBusy(null);
    }
  }

  return (
    <div>
      <p className="text-xs text-slate">Oldest first · times in your firm’s time zone</p>
      {problem && (
        <p role="alert" className="field-error">
          {problem}
        </p>
      )}
      <ol className="mt-2 space-y-3 border-l-2 border-sawdust pl-3" data-testid="timeline">
        {events.map((event) => (
          <li key={event.id} data-testid="timeline-entry" data-kind={event.kind} className={event.undone ? 'text-slate' : undefined}>
            <p className="text-sm">
              <span className={event.undone ? 'font-medium line-through' : 'font-medium'}>{event.label}</span>
              {event.text && <span className={event.undone ? 'line-through' : undefined}> · {event.text}</span>}
            </p>
            <p className="text-xs text-slate">
              {event.who} · <time dateTime={event.at}>{event.when}</time>
            </p>
            {event.undone && (
              <p className="text-xs text-slate">
                Undone by {event.undone.who} · {event.undone.when}
              </p>
            )}
            {event.undoable && (
              <button
                type="button"
                className="mt-1 rounded border border-slate/40 px-2 py-0.5 text-xs hover:bg-sawdust/40 disabled:opacity-60"
                onClick={() => undo(event.id)}
                disabled={busy !== null}
                aria-label={`Undo: ${event.label}, ${event.text}`}
              >
                {busy === event.id ? 'Undoing…' : 'Undo'}
              </button>
            )}
          </li>
        ))}
      </ol>
    </div>
  );
}
