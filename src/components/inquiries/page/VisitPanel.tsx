import '~/lib/shared/zod-in-browser';
import { useId, useState } from 'react';
import useSWR from 'swr';
import { formatInZone } from '~/lib/shared/time';
import type { SlotView } from '~/lib/shared/visit-schemas';
import type { CalendarPerson } from '~/lib/shared/visit-calendar';
import { SlotPicker, slotKey } from '~/components/visits/SlotPicker';
import { clockTime, localDateAt } from '~/components/visits/calendar-time';
import { CancelVisitDialog, MoveVisitDialog, type ChangedVisit, type MoveIntent } from '~/components/visits/VisitDialogs';
import { asVisitFailure, getVisitJson, slotsUrl, visitRequest, type VisitRequestFailed } from '~/components/visits/visit-api';
import { announceLeadChanged } from './api';

type Props = {
  leadId: string;
  leadName: string;
  timeZone: string;
  people: CalendarPerson[];
  /** Whose times are offered first: the inquiry's assignee, or the viewer. */
  defaultSalespersonId: string;
  /** The inquiry's booked visit still to come, if any. */
  initialVisit: ChangedVisit | null;
};

/**
 * The inquiry page's site visit: the one booked (its time on the firm's clock, who goes, Move and
 * Cancel), or the open times of a chosen salesperson to book one, also for a homeowner on the
 * phone. Staff may book inside the firm's minimum notice.
 */
export function VisitPanel({ leadId, leadName, timeZone, people, defaultSalespersonId, initialVisit }: Props) {
  const ids = useId();
  const [visit, setVisit] = useState<ChangedVisit | null>(initialVisit);
  const [salespersonId, setSalespersonId] = useState(defaultSalespersonId);
  const [chosen, setChosen] = useState<SlotView | null>(null);
  const [note, setNote] = useState('');
  const [failure, setFailure] = useState<VisitRequestFailed | null>(null);
  const [busy, setBusy] = useState(false);
  const [done, setDone] = useState<string | null>(null);
  const [moving, setMoving] = useState<MoveIntent | null>(null);
  const [cancelling, setCancelling] = useState(false);
  const names = Object.fromEntries(people.map((p) => [p.id, p.name]));
  const slots = useSWR<{ slots: SlotView[] }>(visit ? null : slotsUrl(salespersonId), getVisitJson);

  async function book(event: { preventDefault(): void }) {
    event.preventDefault();
    if (!chosen) return setFailure(asVisitFailure(new Error('Choose a time first.')));
    setBusy(true);
    setFailure(null);
    setDone(null);
    try {
      const booked = await visitRequest<ChangedVisit>('POST', `/api/app/leads/${leadId}/visits`, {
        start: chosen.start,
        salespersonId: chosen.salespersonId ?? salespersonId,
        ...(note.trim() ? { note: note.trim() } : {}),
      });
      setVisit(booked);
      setChosen(null);
      setNote('');
      setDone('Visit booked. The homeowner and the salesperson get an invitation by e-mail.');
      announceLeadChanged(leadId);
    } catch (error) {
      setFailure(asVisitFailure(error));
      void slots.mutate();
    } finally {
      setBusy(false);
    }
  }

  if (visit) {
    return (
      <div className="space-y-2" data-testid="visit-booked">
        <p>
          <span className="figures font-medium">{formatInZone(visit.start, timeZone, 'dateTimeZone')}</span>
          <span className="text-slate"> to {clockTime(visit.end, timeZone)}</span>
        </p>
        <p className="text-sm">With {visit.salespersonName ?? 'nobody (they left the firm)'}</p>
        {visit.note && <p className="rounded bg-sawdust/30 p-2 text-sm">{visit.note}</p>}
        <div className="flex gap-2">
          <button
            type="button"
            className="button-quiet px-3 py-1 text-sm"
            onClick={() => setMoving({ visit: { id: visit.id, leadName, start: visit.start, salespersonId: visit.salespersonId }, to: null })}
          >
            Move…
          </button>
          <button type="button" className="button-quiet px-3 py-1 text-sm text-brick" onClick={() => setCancelling(true)}>
            Cancel visit
          </button>
          <a href={`/app/visits?date=${localDateAt(new Date(visit.start), timeZone)}`} className="self-center text-sm">
            On the calendar
          </a>
        </div>
        <p role="status" className="text-sm text-lapwing">
          {done}
        </p>
        <MoveVisitDialog
          intent={moving}
          timeZone={timeZone}
          names={names}
          onClose={() => setMoving(null)}
          onMoved={(moved) => {
            setVisit(moved);
            setDone(`Visit moved to ${formatInZone(moved.start, timeZone, 'dateTimeZone')}.`);
            announceLeadChanged(leadId);
          }}
        />
        <CancelVisitDialog
          visit={cancelling ? { id: visit.id, leadName, start: visit.start, salespersonId: visit.salespersonId } : null}
          timeZone={timeZone}
          onClose={() => setCancelling(false)}
          onCancelled={() => {
            setVisit(null);
            setDone('Visit cancelled. The homeowner and the salesperson are told by e-mail.');
            announceLeadChanged(leadId);
          }}
        />
      </div>
    );
  }

  return (
    <form onSubmit={book} noValidate className="space-y-3" data-testid="visit-booking">
      <div className="max-w-xs">
        <label htmlFor={`${ids}-person`} className="field-label">
          Who goes
        </label>
        <select
          id={`${ids}-person`}
          className="field-input"
          value={salespersonId}
          onChange={(e) => {
            setSalespersonId(e.target.value);
            setChosen(null);
            setFailure(null);
          }}
        >
          {people.map((p) => (
            <option key={p.id} value={p.id}>
              {p.name}
            </option>
          ))}
        </select>
      </div>
      <div>
        <p className="field-label" id={`${ids}-times`}>
          Open times <span className="font-normal text-slate">({timeZone})</span>
        </p>
        {slots.error ? (
          <p role="alert" className="field-error">
            {asVisitFailure(slots.error).message}
          </p>
        ) : !slots.data ? (
          <p className="text-sm text-slate">Looking for open times…</p>
        ) : slots.data.slots.length === 0 ? (
          <p className="text-sm text-slate">
            {names[salespersonId] ?? 'They'} has no open times. Set their hours under <a href="/app/visits/hours">Visits → hours</a>.
          </p>
        ) : (
          <SlotPicker
            slots={slots.data.slots}
            timeZone={timeZone}
            value={chosen ? slotKey(chosen) : null}
            onChange={setChosen}
            label="Open times"
            maxDays={7}
          />
        )}
      </div>
      {failure && (
        <div role="alert" className="space-y-2 rounded-md border border-brick/40 bg-brick/5 p-2">
          <p className="text-sm text-brick">{failure.message}</p>
          {failure.alternatives.length > 0 && (
            <>
              <p className="text-sm">The next open times:</p>
              <SlotPicker
                slots={failure.alternatives}
                timeZone={timeZone}
                value={chosen ? slotKey(chosen) : null}
                onChange={(slot) => {
                  setChosen(slot);
                  setFailure(null);
                }}
                label="Next open times"
                names={names}
              />
            </>
          )}
        </div>
      )}
      <div>
        <label htmlFor={`${ids}-note`} className="field-label">
          Note for the visit <span className="font-normal text-slate">(optional)</span>
        </label>
        <textarea
          id={`${ids}-note`}
          className="field-input"
          rows={2}
          maxLength={500}
          value={note}
          onChange={(e) => setNote(e.target.value)}
          placeholder="Parking, gate code, which rooms"
        />
      </div>
      <div className="flex items-center gap-3">
        <button type="submit" className="button-primary" disabled={busy || !chosen}>
          {busy ? 'Booking…' : 'Book visit'}
        </button>
        <p role="status" className="text-sm text-lapwing">
          {chosen ? `Chosen: ${formatInZone(chosen.start, timeZone, 'dateTimeZone')}` : done}
        </p>
      </div>
    </form>
  );
}
