import { useEffect, useId, useMemo, useRef, useState } from 'react';
import type { InquiryProof, PublicSlot, WidgetSlotsAnswer } from '~/lib/shared/widget-visit-schemas';
import { alternativesOf, ApiError, bookVisitTime, fetchVisitSlots } from './api';
import { proofFromViewUrl, slotDays, visitLabel } from './visit-times';

type Offered = Extract<WidgetSlotsAnswer, { offered: true }>;

type Phase =
  | { kind: 'loading' }
  | { kind: 'load-failed'; error: ApiError }
  | { kind: 'hidden' }
  | { kind: 'offer'; answer: Offered }
  | { kind: 'picking'; answer: Offered }
  | { kind: 'booked'; start: string; timeZone: string }
  | { kind: 'declined' };

const asApiError = (error: unknown) => (error instanceof ApiError ? error : new ApiError('Something went wrong. Please try again.', 0));

const BRAND_BUTTON = 'rounded-md bg-[var(--brand)] px-4 py-2 font-medium text-[var(--brand-text)] disabled:opacity-60';

/**
 * The thank-you view's optional visit step: after the inquiry is sent, the homeowner may pick a
 * site-visit time on the firm's clock (the inquiry proven by its private estimate link), or leave
 * it and be called. It shows nothing when the firm offers no times.
 */
export default function VisitStep({ slug, viewUrl, firmName }: { slug: string; viewUrl: string; firmName: string }) {
  const proof = useMemo(() => proofFromViewUrl(viewUrl), [viewUrl]);
  const [phase, setPhase] = useState<Phase>({ kind: 'loading' });
  const [attempt, setAttempt] = useState(0);

  useEffect(() => {
    if (!proof) {
      setPhase({ kind: 'hidden' });
      return;
    }
    let current = true;
    setPhase({ kind: 'loading' });
    fetchVisitSlots(slug, proof).then(
      (answer) => current && setPhase(answer.offered && answer.slots.length ? { kind: 'offer', answer } : { kind: 'hidden' }),
      (error: unknown) => current && setPhase({ kind: 'load-failed', error: asApiError(error) }),
    );
    return () => {
      current = false;
    };
  }, [slug, proof, attempt]);

  const headingRef = useRef<HTMLHeadingElement>(null);
  const doneRef = useRef<HTMLElement>(null);
  // Moves focus where the view changed, so a keyboard or screen reader user is not left on a button that is gone.
  // Each request is a new object, and only a request moves focus (fresh times arriving do not).
  const [focusTarget, setFocusTarget] = useState<{ to: 'heading' | 'done' } | null>(null);
  useEffect(() => {
    if (focusTarget?.to === 'heading') headingRef.current?.focus();
    if (focusTarget?.to === 'done') doneRef.current?.focus();
  }, [focusTarget]);

  const decline = () => {
    setPhase({ kind: 'declined' });
    setFocusTarget({ to: 'done' });
  };

  if (phase.kind === 'loading' || phase.kind === 'hidden' || !proof) return null;

  if (phase.kind === 'declined') {
    return (
      <p ref={doneRef as React.RefObject<HTMLParagraphElement>} tabIndex={-1} className="outline-none" data-testid="visit-declined">
        No problem: {firmName} will call you to find a time for the visit.
      </p>
    );
  }

  if (phase.kind === 'booked') {
    return (
      <section
        ref={doneRef as React.RefObject<HTMLElement>}
        tabIndex={-1}
        role="status"
        className="rounded-lg border-2 border-lapwing bg-white p-4 outline-none"
        data-testid="visit-booked"
      >
        <h3 className="font-bold">Booked: {visitLabel(phase.start, phase.timeZone)}.</h3>
        <p className="mt-1">We sent the details to your e-mail; the e-mail has a link to move or cancel.</p>
      </section>
    );
  }

  return (
    <section aria-labelledby="visit-heading" className="rounded-lg border border-slate/30 bg-white p-4" data-testid="visit-step">
      <h3 id="visit-heading" ref={headingRef} tabIndex={-1} className="text-lg font-bold outline-none">
        Pick a time for the site visit
      </h3>
      {phase.kind === 'load-failed' && (
        <div className="mt-2 space-y-2">
          <p role="alert">{phase.error.message}</p>
          <div className="flex flex-wrap gap-3">
            <button type="button" className="button-quiet" onClick={() => setAttempt((n) => n + 1)}>
              Try again
            </button>
            <button type="button" className="button-quiet" onClick={decline}>
              Not now
            </button>
          </div>
        </div>
      )}
      {phase.kind === 'offer' && (
        <>
          <p className="mt-1 text-slate">
            {firmName} measures on site before giving a firm price. Pick a time for that visit now, or leave it and they will call you.
          </p>
          <div className="mt-3 flex flex-wrap gap-3">
            <button
              type="button"
              className={BRAND_BUTTON}
              onClick={() => {
                setPhase({ kind: 'picking', answer: phase.answer });
                setFocusTarget({ to: 'heading' });
              }}
            >
              Show open times
            </button>
            <button type="button" className="button-quiet" onClick={decline}>
              Not now
            </button>
          </div>
        </>
      )}
      {phase.kind === 'picking' && (
        <TimePicker
          slug={slug}
          proof={proof}
          answer={phase.answer}
          onAnswer={(answer) => setPhase({ kind: 'picking', answer })}
          onBooked={(start, timeZone) => {
            setPhase({ kind: 'booked', start, timeZone });
            setFocusTarget({ to: 'done' });
          }}
          onDecline={decline}
        />
      )}
    </section>
  );
}

/** One choice among the times, drawn as a button; the radio underneath gives arrow keys and the checked state. */
function Choice({ name, checked, onChoose, children }: { name: string; checked: boolean; onChoose: () => void; children: React.ReactNode }) {
  return (
    <label
      className={`choice-card flex cursor-pointer items-center justify-center rounded-md border px-2 py-2 text-sm ${
        checked ? 'border-ink bg-ink font-bold text-white' : 'border-slate/40 bg-white text-ink hover:bg-sawdust/40'
      }`}
    >
      <input type="radio" name={name} className="sr-only" checked={checked} onChange={onChoose} />
      <span>{children}</span>
    </label>
  );
}

function TimePicker({
  slug,
  proof,
  answer,
  onAnswer,
  onBooked,
  onDecline,
}: {
  slug: string;
  proof: InquiryProof;
  answer: Offered;
  onAnswer: (answer: Offered) => void;
  onBooked: (start: string, timeZone: string) => void;
  onDecline: () => void;
}) {
  const id = useId();
  const days = useMemo(() => slotDays(answer.slots, answer.timeZone), [answer]);
  const [date, setDate] = useState(days[0]?.date ?? '');
  const [start, setStart] = useState<string | null>(null);
  const [note, setNote] = useState('');
  const [booking, setBooking] = useState(false);
  const [error, setError] = useState<ApiError | null>(null);
  const [missingTime, setMissingTime] = useState(false);
  const [taken, setTaken] = useState<PublicSlot[] | null>(null);
  const takenRef = useRef<HTMLParagraphElement>(null);
  const day = days.find((d) => d.date === date) ?? days[0];

  useEffect(() => {
    if (taken) takenRef.current?.focus();
  }, [taken]);

  const choose = (chosen: string) => {
    setStart(chosen);
    setMissingTime(false);
  };

  const book = async () => {
    if (!start) {
      setMissingTime(true);
      return;
    }
    setBooking(true);
    setError(null);
    try {
      const booked = await bookVisitTime(slug, { ...proof, start, ...(note.trim() ? { note: note.trim() } : {}) });
      onBooked(booked.visit.start, booked.visit.timeZone);
    } catch (caught) {
      const failure = asApiError(caught);
      const alternatives = failure.status === 409 ? alternativesOf(failure) : [];
      if (alternatives.length) {
        setTaken(alternatives);
        setStart(null);
        // The list below loses the time that went; if this fails, the offered alternatives still stand.
        fetchVisitSlots(slug, proof).then(
          (fresh) => {
            if (fresh.offered && fresh.slots.length) onAnswer(fresh);
          },
          () => undefined,
        );
      } else {
        setError(failure);
      }
    } finally {
      setBooking(false);
    }
  };

  const zoneNote = `${id}-zone`;
  const fieldError = error?.fields.start ?? (missingTime ? 'Choose a time first.' : undefined);
  const noteError = error?.fields.note;
  return (
    <div className="mt-2 space-y-4">
      <p id={zoneNote} className="text-sm text-slate">
        Times are {answer.zoneLabel}.
      </p>

      {taken && (
        <div className="space-y-2">
          <p ref={takenRef} tabIndex={-1} role="alert" className="font-medium text-brick outline-none">
            That time was just taken. These are the next open times.
          </p>
          <fieldset aria-describedby={zoneNote}>
            <legend className="field-label">The next open times</legend>
            <div className="mt-2 grid gap-2 sm:grid-cols-2">
              {taken.map((slot) => (
                <Choice key={slot.start} name={`${id}-next`} checked={start === slot.start} onChoose={() => choose(slot.start)}>
                  {visitLabel(slot.start, answer.timeZone)}
                </Choice>
              ))}
            </div>
          </fieldset>
        </div>
      )}

      <fieldset>
        <legend className="field-label">{taken ? 'Or another day' : 'Day'}</legend>
        <div className="mt-2 flex flex-wrap gap-2">
          {days.map((d) => (
            <Choice
              key={d.date}
              name={`${id}-day`}
              checked={d.date === day?.date}
              onChoose={() => {
                setDate(d.date);
                if (!d.slots.some((s) => s.start === start)) setStart(null);
              }}
            >
              {d.label}
            </Choice>
          ))}
        </div>
      </fieldset>

      {day && (
        <fieldset aria-describedby={fieldError ? `${zoneNote} ${id}-start-error` : zoneNote}>
          <legend className="field-label">Times on {day.label}</legend>
          <div className="mt-2 grid grid-cols-3 gap-2">
            {day.slots.map((slot) => (
              <Choice key={slot.start} name={`${id}-time`} checked={start === slot.start} onChoose={() => choose(slot.start)}>
                {/* The full date in the name: a screen reader hears which day the time is on. */}
                <span className="sr-only">{day.label}, </span>
                {slot.time}
              </Choice>
            ))}
          </div>
          {fieldError && (
            <p id={`${id}-start-error`} className="field-error">
              {fieldError}
            </p>
          )}
        </fieldset>
      )}

      <div>
        <label htmlFor={`${id}-note`} className="field-label">
          A note for the visit (optional)
        </label>
        <p id={`${id}-note-hint`} className="mt-1 text-xs text-slate">
          Gate code, parking, which rooms
        </p>
        <textarea
          id={`${id}-note`}
          className="field-input"
          rows={2}
          maxLength={500}
          value={note}
          aria-describedby={noteError ? `${id}-note-hint ${id}-note-error` : `${id}-note-hint`}
          aria-invalid={noteError ? true : undefined}
          onChange={(event) => setNote(event.target.value)}
        />
        {noteError && (
          <p id={`${id}-note-error`} className="field-error">
            {noteError}
          </p>
        )}
      </div>

      {error && !error.fields.start && !error.fields.note && (
        <div role="alert" className="space-y-2">
          <p className="field-error">{error.message}</p>
          {error.retryable && (
            <button type="button" className="button-quiet" onClick={() => void book()}>
              Try again
            </button>
          )}
        </div>
      )}

      <div className="flex flex-wrap gap-3">
        <button type="button" className={`flex-1 ${BRAND_BUTTON}`} disabled={booking} onClick={() => void book()}>
          {booking ? 'Booking…' : 'Book this time'}
        </button>
        <button type="button" className="button-quiet flex-1" onClick={onDecline}>
          Not now
        </button>
      </div>
    </div>
  );
}
