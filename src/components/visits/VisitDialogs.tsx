import { useState } from 'react';
import useSWR from 'swr';
import type { SlotView } from '~/lib/shared/visit-schemas';
import { Dialog } from './Dialog';
import { SlotPicker, slotKey } from './SlotPicker';
import { shortDayTime } from './calendar-time';
import { asVisitFailure, getVisitJson, slotsUrl, visitRequest, type VisitRequestFailed } from './visit-api';

/** What the dialogs need to know of a visit. */
export type VisitRef = { id: string; leadName: string; start: string; salespersonId: string | null };

/** A visit as the move and cancel routes answer it. */
export type ChangedVisit = { id: string; start: string; end: string; salespersonId: string | null; salespersonName: string | null; note: string | null };

/** How a move began: by dragging to a time (confirm it), or by asking for the list of open times. */
export type MoveIntent = { visit: VisitRef; to: string | null };

type MoveProps = {
  intent: MoveIntent | null;
  timeZone: string;
  names: Record<string, string>;
  onClose: () => void;
  onMoved: (visit: ChangedVisit) => void;
};

/**
 * Moving a visit: the open times of its salesperson to pick from (the keyboard's way, and the
 * phone's), then one question to confirm. A time taken meanwhile (409) shows why and the next
 * open times instead.
 */
export function MoveVisitDialog({ intent, timeZone, names, onClose, onMoved }: MoveProps) {
  const [chosen, setChosen] = useState<SlotView | null>(null);
  const [confirming, setConfirming] = useState(false);
  const [failure, setFailure] = useState<VisitRequestFailed | null>(null);
  const [busy, setBusy] = useState(false);
  const [shownFor, setShownFor] = useState<MoveIntent | null>(null);
  // A new intent starts afresh (state reset during render, React's documented pattern).
  if (intent !== shownFor) {
    setShownFor(intent);
    setChosen(intent?.to ? { start: intent.to, end: intent.to, salespersonId: intent.visit.salespersonId ?? undefined } : null);
    setConfirming(Boolean(intent?.to));
    setFailure(null);
  }
  const picking = intent !== null && !confirming;
  const slots = useSWR<{ slots: SlotView[] }>(picking ? slotsUrl(intent.visit.salespersonId) : null, getVisitJson);

  async function move() {
    if (!intent || !chosen) return;
    setBusy(true);
    setFailure(null);
    try {
      const moved = await visitRequest<ChangedVisit>('POST', `/api/app/visits/${intent.visit.id}/move`, {
        start: chosen.start,
        ...(chosen.salespersonId && chosen.salespersonId !== intent.visit.salespersonId ? { salespersonId: chosen.salespersonId } : {}),
      });
      onMoved(moved);
      onClose();
    } catch (error) {
      setFailure(asVisitFailure(error));
    } finally {
      setBusy(false);
    }
  }

  const name = intent?.visit.leadName ?? '';
  return (
    <Dialog open={intent !== null} title={confirming ? 'Move this visit?' : `Move the visit with ${name}`} onClose={onClose}>
      {intent && picking && (
        <div className="space-y-3">
          <p className="text-sm text-slate">Now {shortDayTime(intent.visit.start, timeZone)}. Choose an open time.</p>
          {slots.error ? (
            <p role="alert" className="field-error">
              {asVisitFailure(slots.error).message}
            </p>
          ) : !slots.data ? (
            <p className="text-sm text-slate">Looking for open times…</p>
          ) : (
            <SlotPicker slots={slots.data.slots} timeZone={timeZone} value={chosen ? slotKey(chosen) : null} onChange={setChosen} label="Open times" />
          )}
          <div className="flex justify-end gap-2">
            <button type="button" className="button-quiet" onClick={onClose}>
              Keep it
            </button>
            <button type="button" className="button-primary" disabled={!chosen} onClick={() => setConfirming(true)}>
              Choose this time
            </button>
          </div>
        </div>
      )}
      {intent && confirming && chosen && (
        <div className="space-y-3">
          <p data-testid="move-question">
            Move the visit with {name} from {shortDayTime(intent.visit.start, timeZone)} to {shortDayTime(chosen.start, timeZone)}
            {chosen.salespersonId && chosen.salespersonId !== intent.visit.salespersonId ? ` with ${names[chosen.salespersonId] ?? 'someone else'}` : ''}?
          </p>
          <p className="text-sm text-slate">The homeowner and the salesperson get the new time by e-mail.</p>
          {failure && (
            <div role="alert" className="space-y-2 rounded-md border border-brick/40 bg-brick/5 p-2">
              <p className="text-sm text-brick">{failure.message}</p>
              {failure.alternatives.length > 0 && (
                <SlotPicker
                  slots={failure.alternatives}
                  timeZone={timeZone}
                  value={slotKey(chosen)}
                  onChange={(slot) => {
                    setChosen(slot);
                    setFailure(null);
                  }}
                  label="Next open times"
                  names={names}
                />
              )}
            </div>
          )}
          <div className="flex justify-end gap-2">
            <button type="button" className="button-quiet" onClick={onClose}>
              Keep it
            </button>
            <button type="button" className="button-primary" disabled={busy || Boolean(failure)} onClick={() => void move()}>
              {busy ? 'Moving…' : 'Move visit'}
            </button>
          </div>
        </div>
      )}
    </Dialog>
  );
}

type CancelProps = {
  visit: VisitRef | null;
  timeZone: string;
  onClose: () => void;
  onCancelled: () => void;
};

/** Cancelling a visit, after one question. */
export function CancelVisitDialog({ visit, timeZone, onClose, onCancelled }: CancelProps) {
  const [failure, setFailure] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function cancel() {
    if (!visit) return;
    setBusy(true);
    setFailure(null);
    try {
      await visitRequest('POST', `/api/app/visits/${visit.id}/cancel`);
      onCancelled();
      onClose();
    } catch (error) {
      setFailure(asVisitFailure(error).message);
    } finally {
      setBusy(false);
    }
  }

  return (
    <Dialog open={visit !== null} title="Cancel this visit?" onClose={onClose}>
      {visit && (
        <div className="space-y-3">
          <p>
            Cancel the visit with {visit.leadName} on {shortDayTime(visit.start, timeZone)}? The homeowner and the salesperson are told by e-mail, and the time
            is open again.
          </p>
          {failure && (
            <p role="alert" className="field-error">
              {failure}
            </p>
          )}
          <div className="flex justify-end gap-2">
            <button type="button" className="button-quiet" onClick={onClose}>
              Keep it
            </button>
            <button type="button" className="button-primary bg-brick hover:bg-brick/90" disabled={busy} onClick={() => void cancel()}>
              {busy ? 'Cancelling…' : 'Cancel visit'}
            </button>
          </div>
        </div>
      )}
    </Dialog>
  );
}
