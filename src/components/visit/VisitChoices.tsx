import '~/lib/shared/zod-in-browser';
import { useState } from 'react';
import { format } from 'date-fns';
import { tz } from '@date-fns/tz';
import { formatInZone } from '~/lib/shared/time';
import { aboutHowLong, type HomeownerVisitView } from '~/lib/shared/homeowner-visit';
import type { SlotView } from '~/lib/shared/visit-schemas';

type Props = { token: string; initial: HomeownerVisitView };

type Mode = 'idle' | 'choosing' | 'confirm-cancel';
type Status = { kind: 'done' | 'failed'; text: string } | null;
type Answer = Partial<HomeownerVisitView> & { error?: string; fields?: Record<string, string>; alternatives?: SlotView[] };

const UNREACHABLE = 'We could not reach the server. Check your connection, then try again.';

async function post(url: string, body: unknown): Promise<{ ok: boolean; status: number; answer: Answer }> {
  const response = await fetch(url, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body), credentials: 'omit' });
  const answer = (await response.json().catch(() => ({}))) as Answer;
  return { ok: response.ok, status: response.status, answer };
}

const slotKey = (s: SlotView) => `${s.start}|${s.salespersonId ?? ''}`;

/**
 * The homeowner's choices on their visit's page: the visit as it stands (on the firm's clock,
 * labelled with its zone), another open time, or cancelling after a confirmation. A time taken in
 * the meantime (409) shows the open times that the server offers instead.
 */
export default function VisitChoices({ token, initial }: Props) {
  const [view, setView] = useState(initial);
  const [mode, setMode] = useState<Mode>('idle');
  const [status, setStatus] = useState<Status>(null);
  const [busy, setBusy] = useState(false);
  const [alternatives, setAlternatives] = useState<SlotView[]>([]);
  const zone = view.timeZone;
  const dayOf = (s: SlotView) => format(new Date(s.start), 'yyyy-MM-dd', { in: tz(zone) });
  const byDay = new Map<string, SlotView[]>();
  for (const slot of view.slots) byDay.set(dayOf(slot), [...(byDay.get(dayOf(slot)) ?? []), slot]);
  const days = [...byDay.entries()];
  const [day, setDay] = useState<string>(days[0]?.[0] ?? '');
  const [chosen, setChosen] = useState<string>('');
  const timesOfDay = days.find(([d]) => d === day)?.[1] ?? [];
  const chosenSlot = [...view.slots, ...alternatives].find((s) => slotKey(s) === chosen);
  const when = formatInZone(view.start, zone, 'dateTimeZone');
  const timeText = (s: SlotView) => format(new Date(s.start), 'h:mm a', { in: tz(zone) });
  const dayText = (d: string) => format(new Date(`${d}T12:00:00Z`), 'EEEE, MMM d', { in: tz('UTC') });
  const phone = view.firm.phone ? ` Call ${view.firm.name} on ${view.firm.phone}.` : '';

  const send = async (path: 'move' | 'cancel', body: unknown, done: (next: HomeownerVisitView) => string) => {
    setBusy(true);
    setStatus(null);
    try {
      const { ok, status: code, answer } = await post(`/api/visit/${token}/${path}`, body);
      if (ok) {
        const next = answer as HomeownerVisitView;
        setView(next);
        setMode('idle');
        setAlternatives([]);
        setChosen('');
        const firstDay = next.slots[0] ? format(new Date(next.slots[0].start), 'yyyy-MM-dd', { in: tz(next.timeZone) }) : '';
        setDay(firstDay);
        setStatus({ kind: 'done', text: done(next) });
        return;
      }
      if (code === 409 && answer.alternatives?.length) setAlternatives(answer.alternatives);
      setStatus({ kind: 'failed', text: Object.values(answer.fields ?? {})[0] ?? answer.error ?? 'That did not work. Please try again.' });
    } catch {
      setStatus({ kind: 'failed', text: UNREACHABLE });
    } finally {
      setBusy(false);
    }
  };

  const move = () =>
    chosenSlot &&
    void send('move', { start: chosenSlot.start, ...(chosenSlot.salespersonId ? { salespersonId: chosenSlot.salespersonId } : {}) }, (next) => {
      return `Done: your visit is now on ${formatInZone(next.start, next.timeZone, 'dateTimeZone')}. We have e-mailed you the new time.`;
    });
  const cancel = () => void send('cancel', {}, () => `Your visit is cancelled. Nobody will come.${phone}`);

  return (
    <div className="mt-6 space-y-6">
      <dl className="grid gap-3 sm:grid-cols-[8rem_1fr]">
        <dt className="font-medium">When</dt>
        <dd>
          <span data-testid="visit-when" className={view.state === 'cancelled' ? 'line-through' : 'font-bold'}>
            {when}
          </span>
          <span className="block text-sm text-slate">
            Times on this page are on {view.firm.name}’s clock ({zone}), for {aboutHowLong(new Date(view.start), new Date(view.end))}.
          </span>
        </dd>
        <dt className="font-medium">Who comes</dt>
        <dd>{view.salespersonName ? `${view.salespersonName} from ${view.firm.name}` : `Someone from ${view.firm.name}`}</dd>
        <dt className="font-medium">Where</dt>
        <dd>{view.place}</dd>
      </dl>

      {view.state === 'cancelled' && (
        <p className="rounded-md border border-brick/40 bg-white p-3" data-testid="visit-closed">
          This visit is cancelled.{phone}
        </p>
      )}

      {view.state === 'open' && mode === 'idle' && (
        <div className="flex flex-wrap gap-3">
          <button type="button" className="button-primary" onClick={() => (setMode('choosing'), setStatus(null))} disabled={view.slots.length === 0}>
            Choose another time
          </button>
          <button type="button" className="button-quiet border-brick/50 text-brick" onClick={() => (setMode('confirm-cancel'), setStatus(null))}>
            Cancel the visit
          </button>
          {view.slots.length === 0 && <p className="w-full text-sm text-slate">No other times are open online right now.{phone}</p>}
        </div>
      )}

      {view.state === 'open' && mode === 'choosing' && (
        <fieldset className="space-y-3 rounded-md border border-slate/40 bg-white p-4">
          <legend className="px-1 font-bold">Choose another time</legend>
          <label className="field-label" htmlFor="visit-day">
            Day
          </label>
          <select
            id="visit-day"
            className="field-input"
            value={day}
            onChange={(event) => {
              setDay(event.target.value);
              setChosen('');
            }}
          >
            {days.map(([d]) => (
              <option key={d} value={d}>
                {dayText(d)}
              </option>
            ))}
          </select>
          <div role="radiogroup" aria-label="Time" className="flex flex-wrap gap-2">
            {timesOfDay.map((slot) => (
              <label key={slotKey(slot)} className="inline-flex items-center gap-1 rounded-md border border-slate/40 px-3 py-1">
                <input type="radio" name="visit-time" value={slotKey(slot)} checked={chosen === slotKey(slot)} onChange={() => setChosen(slotKey(slot))} />
                <span className="figures">{timeText(slot)}</span>
              </label>
            ))}
          </div>
          <div className="flex flex-wrap gap-3">
            <button type="button" className="button-primary" disabled={!chosenSlot || busy} onClick={move}>
              {busy ? 'Moving…' : chosenSlot ? `Move my visit to ${dayText(dayOf(chosenSlot))}, ${timeText(chosenSlot)}` : 'Pick a time first'}
            </button>
            <button type="button" className="button-quiet" onClick={() => (setMode('idle'), setAlternatives([]))}>
              Keep {when}
            </button>
          </div>
          {alternatives.length > 0 && (
            <div>
              <p className="text-sm font-medium">Open instead:</p>
              <ul className="mt-1 flex flex-wrap gap-2" aria-label="Other open times">
                {alternatives.map((slot) => (
                  <li key={slotKey(slot)}>
                    <button
                      type="button"
                      className="button-quiet"
                      onClick={() => {
                        setDay(dayOf(slot));
                        setChosen(slotKey(slot));
                      }}
                    >
                      {dayText(dayOf(slot))}, {timeText(slot)}
                    </button>
                  </li>
                ))}
              </ul>
            </div>
          )}
        </fieldset>
      )}

      {view.state === 'open' && mode === 'confirm-cancel' && (
        <div className="space-y-3 rounded-md border border-brick/40 bg-white p-4" role="group" aria-labelledby="cancel-question">
          <p id="cancel-question" className="font-medium">
            Cancel your visit on {when}? Nobody will come, and the time is offered to others.
          </p>
          <div className="flex flex-wrap gap-3">
            <button type="button" className="button-primary bg-brick hover:bg-brick" disabled={busy} onClick={cancel}>
              {busy ? 'Cancelling…' : 'Yes, cancel the visit'}
            </button>
            <button type="button" className="button-quiet" onClick={() => setMode('idle')}>
              No, keep it
            </button>
          </div>
        </div>
      )}

      <p role="status" className={status?.kind === 'failed' ? 'text-brick' : 'text-lapwing'} data-testid="visit-status">
        {status?.text}
      </p>
    </div>
  );
}
