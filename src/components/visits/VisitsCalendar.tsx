import '~/lib/shared/zod-in-browser';
import { useEffect, useId, useMemo, useRef, useState, type PointerEvent as ReactPointerEvent } from 'react';
import useSWR from 'swr';
import { zoneAbbreviation } from '~/lib/shared/time';
import { VISIT_STATUS_LABELS } from '~/lib/shared/visit-schemas';
import type { CalendarPerson, CalendarVisit } from '~/lib/shared/visit-calendar';
import {
  addDays,
  clockTime,
  dateHeading,
  hourLabel,
  initials,
  instantAt,
  layoutLanes,
  localDateAt,
  mondayOf,
  openMinutesOn,
  rangeOfDates,
  shortDayTime,
  snapToStep,
  wallMinutesAt,
  weekDates,
  type LocalDate,
  type PersonHours,
} from './calendar-time';
import { CancelVisitDialog, MoveVisitDialog, type MoveIntent, type VisitRef } from './VisitDialogs';
import { asVisitFailure, getVisitJson } from './visit-api';

type Props = {
  timeZone: string;
  /** Today on the firm's clock, as the server saw it (so the first render matches). */
  today: LocalDate;
  /** The date the calendar opens on (its week is shown; the phone's day list shows that day). */
  initialDate: LocalDate;
  /** Whose visits: a membership id, or '' for everyone. */
  initialPerson: string;
  people: CalendarPerson[];
  hours: PersonHours[];
  stepMinutes: number;
  /** The visits of the first week shown, for the first render. */
  initialVisits: { key: string; visits: CalendarVisit[] };
};

const HOUR_PX = 56;
const PX_PER_MINUTE = HOUR_PX / 60;
/** A pointer must travel this far before a press becomes a drag (so a click still opens the inquiry). */
const DRAG_THRESHOLD_PX = 5;

export function calendarKey(from: Date, to: Date, person: string): string {
  const query = new URLSearchParams({ from: from.toISOString(), to: to.toISOString() });
  if (person) query.set('salespersonId', person);
  return `/api/app/visits?${query}`;
}

type Drag = {
  visit: CalendarVisit;
  pointerId: number;
  originX: number;
  originY: number;
  originDay: number;
  originMinutes: number;
  duration: number;
  day: number;
  minutes: number;
  moved: boolean;
  columnWidth: number;
};

const asRef = (visit: CalendarVisit): VisitRef => ({ id: visit.id, leadName: visit.leadName, start: visit.start, salespersonId: visit.salespersonId });

/**
 * The Visits calendar: a week of day columns on the firm's clock with each visit placed by its
 * wall-clock start and length and the open hours shaded, for one person or the whole team; a day
 * list instead on narrow screens. Drag a visit to move it (then confirm), or use its Move… button
 * to pick from the open times.
 */
export function VisitsCalendar({ timeZone, today, initialDate, initialPerson, people, hours, stepMinutes, initialVisits }: Props) {
  const ids = useId();
  const [focusDay, setFocusDay] = useState<LocalDate>(initialDate);
  const [person, setPerson] = useState(initialPerson);
  const [moving, setMoving] = useState<MoveIntent | null>(null);
  const [cancelling, setCancelling] = useState<VisitRef | null>(null);
  const [status, setStatus] = useState<{ kind: 'done' | 'failed'; text: string } | null>(null);
  const [drag, setDrag] = useState<Drag | null>(null);
  const justDragged = useRef(false);
  const columns = useRef<HTMLDivElement>(null);

  const monday = mondayOf(focusDay);
  const dates = weekDates(monday);
  const range = useMemo(() => rangeOfDates(monday, 7, timeZone), [monday, timeZone]);
  const key = calendarKey(range.from, range.to, person);
  const { data, error, mutate } = useSWR<{ visits: CalendarVisit[] }>(key, getVisitJson, {
    fallbackData: key === initialVisits.key ? { visits: initialVisits.visits } : undefined,
    keepPreviousData: true,
  });
  const visits = data?.visits ?? [];
  const names = Object.fromEntries(people.map((p) => [p.id, p.name]));
  const shownHours = person ? hours.filter((h) => h.membershipId === person) : hours;

  useEffect(() => {
    const query = new URLSearchParams(window.location.search);
    query.set('date', focusDay);
    if (person) query.set('person', person);
    else query.delete('person');
    window.history.replaceState(null, '', `${window.location.pathname}?${query}`);
  }, [focusDay, person]);

  // Placed on the firm's clock: local date, minutes after midnight, real length.
  const placed = visits.map((visit) => {
    const start = new Date(visit.start);
    const minutes = wallMinutesAt(start, timeZone);
    const duration = Math.max(15, (Date.parse(visit.end) - start.getTime()) / 60_000);
    return { visit, date: localDateAt(start, timeZone), start: minutes, end: minutes + duration, duration };
  });

  // Hours down the side: at least 7 AM to 7 PM, widened to every open hour and visit of the week.
  const openByDate = dates.map((date) => openMinutesOn(date, shownHours));
  const firstMinute = Math.min(7 * 60, ...openByDate.flat().map((r) => r.from), ...placed.map((p) => p.start));
  const lastMinute = Math.max(19 * 60, ...openByDate.flat().map((r) => r.to), ...placed.map((p) => p.end));
  const gridStart = Math.floor(firstMinute / 60) * 60;
  const gridEnd = Math.min(24 * 60, Math.ceil(lastMinute / 60) * 60);
  const hourMarks = Array.from({ length: (gridEnd - gridStart) / 60 }, (_, i) => gridStart + i * 60);

  const changed = (text: string) => {
    setStatus({ kind: 'done', text });
    void mutate();
  };

  function startPress(event: ReactPointerEvent<HTMLElement>, visit: CalendarVisit, dayIndex: number, minutes: number, duration: number) {
    if (visit.status !== 'booked' || event.button !== 0) return;
    setDrag({
      visit,
      pointerId: event.pointerId,
      originX: event.clientX,
      originY: event.clientY,
      originDay: dayIndex,
      originMinutes: minutes,
      duration,
      day: dayIndex,
      minutes,
      moved: false,
      columnWidth: (columns.current?.getBoundingClientRect().width ?? 700) / 7,
    });
  }

  function movePress(event: ReactPointerEvent<HTMLElement>) {
    if (!drag || event.pointerId !== drag.pointerId) return;
    const dx = event.clientX - drag.originX;
    const dy = event.clientY - drag.originY;
    if (!drag.moved && Math.hypot(dx, dy) < DRAG_THRESHOLD_PX) return;
    // Captured only once it is a drag: a plain press must still reach the link as a click.
    if (!drag.moved) event.currentTarget.setPointerCapture(event.pointerId);
    const day = Math.min(6, Math.max(0, drag.originDay + Math.round(dx / drag.columnWidth)));
    const minutes = Math.min(gridEnd - drag.duration, Math.max(gridStart, snapToStep(drag.originMinutes + dy / PX_PER_MINUTE, stepMinutes)));
    setDrag({ ...drag, moved: true, day, minutes });
  }

  function endPress(event: ReactPointerEvent<HTMLElement>) {
    if (!drag || event.pointerId !== drag.pointerId) return;
    setDrag(null);
    if (!drag.moved) return;
    // The click that ends a drag must not open the inquiry; any later click must.
    justDragged.current = true;
    setTimeout(() => (justDragged.current = false), 0);
    if (drag.day === drag.originDay && drag.minutes === drag.originMinutes) return;
    const to = instantAt(dates[drag.day]!, drag.minutes, timeZone);
    if (!to) {
      setStatus({ kind: 'failed', text: 'The clock skips that time on that day (the clocks go forward). Choose another time.' });
      return;
    }
    setMoving({ visit: asRef(drag.visit), to: to.toISOString() });
  }

  const zoneLabel = `Times in ${timeZone} (${zoneAbbreviation(range.from, timeZone)})`;
  const dayVisits = placed.filter((p) => p.date === focusDay).sort((a, b) => a.visit.start.localeCompare(b.visit.start));

  return (
    <div className="mt-4 space-y-3">
      <div className="flex flex-wrap items-end gap-3">
        <div>
          <label htmlFor={`${ids}-person`} className="field-label">
            Whose visits
          </label>
          <select id={`${ids}-person`} className="field-input" value={person} onChange={(e) => setPerson(e.target.value)}>
            <option value="">Whole team</option>
            {people.map((p) => (
              <option key={p.id} value={p.id}>
                {p.name}
              </option>
            ))}
          </select>
        </div>
        <div className="hidden gap-1 sm:flex" role="group" aria-label="Week">
          <button type="button" className="button-quiet px-3" onClick={() => setFocusDay(addDays(focusDay, -7))}>
            ← Previous week
          </button>
          <button type="button" className="button-quiet px-3" onClick={() => setFocusDay(today)} aria-pressed={dates.includes(today)}>
            This week
          </button>
          <button type="button" className="button-quiet px-3" onClick={() => setFocusDay(addDays(focusDay, 7))}>
            Next week →
          </button>
        </div>
        <p className="text-sm text-slate" data-testid="calendar-zone">
          {zoneLabel}
        </p>
      </div>
      <StatusText status={status} />
      {error && (
        <p role="alert" className="field-error">
          {asVisitFailure(error).message}
        </p>
      )}

      {/* The week, from 640 px up. */}
      <section className="hidden sm:block" aria-label={`Week of ${dateHeading(monday)}`} data-testid="week-view">
        <div className="grid grid-cols-[3.5rem_1fr] rounded-md border border-slate/30 bg-white">
          <div />
          <div className="grid grid-cols-7 border-b border-slate/30">
            {dates.map((date) => (
              <h2
                key={date}
                className={`px-2 py-1.5 text-sm font-medium ${date === today ? 'bg-sawdust' : ''}`}
                aria-current={date === today ? 'date' : undefined}
              >
                {dateHeading(date)}
              </h2>
            ))}
          </div>
          <div className="relative" style={{ height: (gridEnd - gridStart) * PX_PER_MINUTE }} aria-hidden="true">
            {hourMarks.map((m) => (
              <span key={m} className="figures absolute right-1 -translate-y-2 text-xs text-slate" style={{ top: (m - gridStart) * PX_PER_MINUTE }}>
                {m === gridStart ? '' : hourLabel(m)}
              </span>
            ))}
          </div>
          <div ref={columns} className="relative grid grid-cols-7" style={{ height: (gridEnd - gridStart) * PX_PER_MINUTE }}>
            {dates.map((date, dayIndex) => (
              <div key={date} className="relative border-l border-slate/20 bg-slate/10" data-testid={`day-${date}`}>
                {openByDate[dayIndex]!.map((r) => (
                  <div
                    key={r.from}
                    className="absolute inset-x-0 bg-white"
                    style={{ top: (r.from - gridStart) * PX_PER_MINUTE, height: (r.to - r.from) * PX_PER_MINUTE }}
                    data-testid="open-hours"
                  />
                ))}
                {hourMarks.map((m) => (
                  <div key={m} className="pointer-events-none absolute inset-x-0 border-t border-slate/15" style={{ top: (m - gridStart) * PX_PER_MINUTE }} />
                ))}
                {layoutLanes(placed.filter((p) => p.date === date)).map((p) => {
                  const dragging = drag?.visit.id === p.visit.id && drag.moved;
                  const top = ((dragging ? drag.minutes : p.start) - gridStart) * PX_PER_MINUTE;
                  const shift = dragging ? `translateX(${(drag.day - dayIndex) * drag.columnWidth}px)` : undefined;
                  const booked = p.visit.status === 'booked';
                  const who = p.visit.salespersonName ?? 'Nobody (left the firm)';
                  return (
                    <div
                      key={p.visit.id}
                      className={`group absolute select-none overflow-hidden rounded border text-xs shadow-sm ${
                        booked ? 'border-lapwing-dark bg-lapwing text-white' : 'border-slate/40 bg-wood text-ink'
                      } ${dragging ? 'z-20 opacity-80 ring-2 ring-ink' : 'z-10'} ${booked ? 'cursor-grab touch-none' : ''}`}
                      style={{
                        top,
                        height: Math.max(22, p.duration * PX_PER_MINUTE - 2),
                        left: `calc(${(p.lane / p.lanes) * 100}% + 2px)`,
                        width: `calc(${100 / p.lanes}% - 4px)`,
                        transform: shift,
                      }}
                      data-testid="visit-block"
                      data-visit-id={p.visit.id}
                      onPointerDown={(e) => startPress(e, p.visit, dayIndex, p.start, p.duration)}
                      onPointerMove={movePress}
                      onPointerUp={endPress}
                      onPointerCancel={() => setDrag(null)}
                      onClickCapture={(e) => {
                        if (!justDragged.current) return;
                        justDragged.current = false;
                        e.preventDefault();
                        e.stopPropagation();
                      }}
                    >
                      <a
                        href={`/app/leads/${p.visit.leadId}`}
                        draggable={false}
                        className="block h-full px-1.5 py-0.5 text-inherit no-underline hover:underline"
                        aria-label={`${p.visit.leadName}, ${shortDayTime(p.visit.start, timeZone)} to ${clockTime(p.visit.end, timeZone)}, with ${who}${
                          booked ? '' : `, ${VISIT_STATUS_LABELS[p.visit.status]}`
                        }`}
                      >
                        <span className="figures font-medium">
                          {clockTime(dragging ? (instantAt(dates[drag.day]!, drag.minutes, timeZone) ?? p.visit.start) : p.visit.start, timeZone)}
                        </span>
                        {!person && <span title={who}> · {p.visit.salespersonName ? initials(p.visit.salespersonName) : '—'}</span>}
                        {!booked && <span> · {VISIT_STATUS_LABELS[p.visit.status]}</span>}
                        <span className="block truncate">{p.visit.leadName}</span>
                      </a>
                      {booked && (
                        <span className="absolute bottom-0.5 right-0.5 flex gap-0.5 opacity-0 focus-within:opacity-100 group-hover:opacity-100">
                          <button
                            type="button"
                            className="rounded bg-white px-1 text-[11px] text-ink"
                            onPointerDown={(e) => e.stopPropagation()}
                            onClick={() => setMoving({ visit: asRef(p.visit), to: null })}
                            aria-label={`Move the visit with ${p.visit.leadName}…`}
                          >
                            Move…
                          </button>
                          <button
                            type="button"
                            className="rounded bg-white px-1 text-[11px] text-brick"
                            onPointerDown={(e) => e.stopPropagation()}
                            onClick={() => setCancelling(asRef(p.visit))}
                            aria-label={`Cancel the visit with ${p.visit.leadName}`}
                          >
                            Cancel
                          </button>
                        </span>
                      )}
                    </div>
                  );
                })}
              </div>
            ))}
          </div>
        </div>
        <p className="mt-1 text-xs text-slate">White: open hours. Drag a visit to move it, or use its Move… button. Select a visit to open its inquiry.</p>
      </section>

      {/* One day at a time on a phone. */}
      <section className="sm:hidden" aria-labelledby={`${ids}-day`} data-testid="day-list">
        <div className="flex items-center justify-between gap-2">
          <button type="button" className="button-quiet px-3" onClick={() => setFocusDay(addDays(focusDay, -1))} aria-label="Previous day">
            ←
          </button>
          <h2 id={`${ids}-day`} className="font-bold">
            {dateHeading(focusDay)}
            {focusDay === today ? ' (today)' : ''}
          </h2>
          <button type="button" className="button-quiet px-3" onClick={() => setFocusDay(addDays(focusDay, 1))} aria-label="Next day">
            →
          </button>
        </div>
        {focusDay !== today && (
          <button type="button" className="mt-2 text-sm text-lapwing underline" onClick={() => setFocusDay(today)}>
            Back to today
          </button>
        )}
        {dayVisits.length === 0 ? (
          <p className="mt-3 text-sm text-slate">No visits this day.</p>
        ) : (
          <ul className="mt-3 space-y-2">
            {dayVisits.map(({ visit }) => (
              <li key={visit.id} className="rounded-md border border-slate/30 bg-white p-3" data-testid="visit-card">
                <p className="figures font-medium">
                  {clockTime(visit.start, timeZone)} – {clockTime(visit.end, timeZone)}
                  {visit.status !== 'booked' && <span className="ml-2 rounded bg-wood px-1.5 text-xs">{VISIT_STATUS_LABELS[visit.status]}</span>}
                </p>
                <p>
                  <a href={`/app/leads/${visit.leadId}`}>{visit.leadName}</a> <span className="text-sm text-slate">· {visit.reference}</span>
                </p>
                <p className="text-sm">
                  {visit.address}, {visit.postcode}
                </p>
                <p className="text-sm text-slate">With {visit.salespersonName ?? 'nobody (they left the firm)'}</p>
                {visit.status === 'booked' && (
                  <div className="mt-2 flex gap-2">
                    <button type="button" className="button-quiet px-3 py-1 text-sm" onClick={() => setMoving({ visit: asRef(visit), to: null })}>
                      Move…
                    </button>
                    <button type="button" className="button-quiet px-3 py-1 text-sm text-brick" onClick={() => setCancelling(asRef(visit))}>
                      Cancel visit
                    </button>
                  </div>
                )}
              </li>
            ))}
          </ul>
        )}
        <p className="mt-2 text-xs text-slate">{zoneLabel}</p>
      </section>

      <MoveVisitDialog
        intent={moving}
        timeZone={timeZone}
        names={names}
        onClose={() => setMoving(null)}
        onMoved={(visit) => changed(`Visit with ${moving?.visit.leadName ?? ''} moved to ${shortDayTime(visit.start, timeZone)}.`)}
      />
      <CancelVisitDialog
        visit={cancelling}
        timeZone={timeZone}
        onClose={() => setCancelling(null)}
        onCancelled={() => changed(`Visit with ${cancelling?.leadName ?? ''} cancelled.`)}
      />
    </div>
  );
}

function StatusText({ status }: { status: { kind: 'done' | 'failed'; text: string } | null }) {
  return (
    <p role="status" className={`min-h-5 text-sm ${status?.kind === 'failed' ? 'text-brick' : 'text-lapwing'}`}>
      {status?.text}
    </p>
  );
}
