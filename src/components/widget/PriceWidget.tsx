import '~/lib/shared/zod-in-browser';
import { Suspense, lazy, useEffect, useMemo, useRef, useState } from 'react';
import useSWR from 'swr';
import type { Units } from '~/lib/estimate/index.ts';
import type { ContactInput } from '~/lib/shared/lead-schemas';
import { ApiError, fetchEstimate, sendLead, type SentLead } from './api';
import { LiveRange, type LiveRangeState } from './LiveRange';
import { draftWaitingContext, fieldStep, newDraft, newKey, newRoom, normaliseServerErrors, toProject, unansweredQuestions, type Draft } from './draft';
import { chooseFormToken, clearDraft, loadDraft, rekey, saveDraft, tabStorage, type SavedPhoto } from './draft-storage';
import { focusFirstError } from './focus-first-error';
import { OptionsStep } from './OptionsStep';
import { ResultView } from './ResultView';
import { RoomsStep } from './RoomsStep';
import { TreatmentStep, type OfferedTreatment } from './TreatmentStep';
import { waitingFor, type WaitingContext } from './waiting-for';

// The photo and contact steps carry the heavier libraries (dropzone, form validation, phone
// numbers); they load in the background once the homeowner is past the first step.
const loadContactStep = () => import('./ContactStep');
const loadPhotoPicker = () => import('./PhotoPicker');
const ContactStep = lazy(() => loadContactStep().then((module) => ({ default: module.ContactStep })));
const PhotoPicker = lazy(loadPhotoPicker);
// The optional visit step after Send: loaded with the contact step, so the thank-you need not wait for it.
const loadVisitStep = () => import('./VisitStep');
const VisitStep = lazy(loadVisitStep);

export type PriceWidgetProps = {
  slug: string;
  formToken: string;
  firmName: string;
  /** Shown on the thank-you screen; null when the firm has none on file. */
  firmPhone?: string | null;
  units: Units;
  treatments: OfferedTreatment[];
  /** The page that embeds us, already checked against the firm's allowed sites; null when opened directly. */
  hostOrigin: string | null;
  /** How long a form token is good for, so a draft restored after a reload can keep its own. */
  formTokenTtlMs?: number;
};

const STEPS = [
  { id: 'rooms', title: 'Your rooms' },
  { id: 'treatment', title: 'Treatment and height' },
  { id: 'options', title: 'A few details' },
  { id: 'photos', title: 'Photos' },
  { id: 'result', title: 'Your price range' },
  { id: 'contact', title: 'Your details' },
] as const;

function useDebounced<T>(value: T, ms: number): T {
  const [current, setCurrent] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setCurrent(value), ms);
    return () => clearTimeout(timer);
  }, [value, ms]);
  return current;
}

/**
 * Tells the embedding page how tall our content is, so its iframe neither scrolls nor leaves blank
 * space. The content box is measured, not the document: the document's scrollHeight is never less
 * than the frame itself, so the frame could grow but never shrink (docs/sources.md §62).
 */
function useReportHeight(hostOrigin: string | null, content: React.RefObject<HTMLDivElement | null>, view: string) {
  useEffect(() => {
    const element = content.current;
    if (!hostOrigin || window.parent === window || !element) return;
    let last = -1;
    const report = () => {
      const height = Math.ceil(element.getBoundingClientRect().height);
      if (height === last) return;
      last = height;
      window.parent.postMessage({ type: 'lapwing:height', height }, hostOrigin);
    };
    const observer = new ResizeObserver(report);
    observer.observe(element);
    report();
    return () => observer.disconnect();
    // A new view may be a new element: observe again.
  }, [hostOrigin, content, view]);
}

/** Tells the embedding page a new step began, so it can bring the frame's top into view. */
function useReportStep(hostOrigin: string | null, stepKey: string) {
  const first = useRef(true);
  useEffect(() => {
    if (first.current) {
      first.current = false;
      return;
    }
    if (hostOrigin && window.parent !== window) window.parent.postMessage({ type: 'lapwing:step' }, hostOrigin);
  }, [hostOrigin, stepKey]);
}

const DAY_MS = 24 * 60 * 60 * 1000;

export default function PriceWidget({
  slug,
  formToken: freshToken,
  firmName,
  firmPhone = null,
  units,
  treatments,
  hostOrigin,
  formTokenTtlMs = DAY_MS,
}: PriceWidgetProps) {
  const [draft, setDraft] = useState<Draft>(() => ({ ...newDraft(units), treatmentId: treatments.length === 1 ? treatments[0]!.id : null }));
  const [step, setStep] = useState(0);
  const [photos, setPhotos] = useState<SavedPhoto[]>([]);
  const [photosBusy, setPhotosBusy] = useState(false);
  const [showErrors, setShowErrors] = useState(false);
  const [sending, setSending] = useState(false);
  const [sendError, setSendError] = useState<ApiError | null>(null);
  const [sent, setSent] = useState<SentLead | null>(null);
  const [formToken, setFormToken] = useState(freshToken);
  // One key per widget visit (kept across a reload): a double tap or a retried send makes one lead.
  const [idempotencyKey, setIdempotencyKey] = useState<string>(() => crypto.randomUUID());
  // False until the saved draft (if any) is back: saving before that would overwrite it.
  const [restored, setRestored] = useState(false);
  const headingRef = useRef<HTMLHeadingElement>(null);
  // Counts refused Next presses, so each one moves focus to the first answer to fix.
  const stepRef = useRef<HTMLDivElement>(null);
  const [refusals, setRefusals] = useState(0);
  useEffect(() => {
    if (refusals > 0) focusFirstError(stepRef.current);
  }, [refusals]);
  const contentRef = useRef<HTMLDivElement>(null);
  useReportHeight(hostOrigin, contentRef, sent ? 'sent' : 'steps');
  useReportStep(hostOrigin, sent ? 'sent' : String(step));

  // Restored after the first render (the server rendered a fresh form), never during it.
  useEffect(() => {
    const saved = loadDraft(tabStorage(), slug, units);
    if (saved) {
      const token = chooseFormToken(saved.formToken, freshToken, formTokenTtlMs);
      const back = rekey(saved.draft, newKey) as Partial<Draft> & { rooms: Partial<Draft['rooms'][number]>[] };
      setDraft({ ...newDraft(units), ...back, rooms: back.rooms.map((room) => ({ ...newRoom(units), ...room })) } as Draft);
      setStep(Math.min(Math.max(saved.step, 0), STEPS.length - 1));
      setFormToken(token.formToken);
      // Photos belong to the token they were uploaded under; with a new token they are not the draft's.
      if (token.kept) setPhotos(saved.photos);
      if (token.kept && saved.idempotencyKey) setIdempotencyKey(saved.idempotencyKey);
    }
    setRestored(true);
    // Once, on arrival.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  useEffect(() => {
    if (!restored || sent) return;
    saveDraft(tabStorage(), { slug, units, formToken, step, draft, photos, idempotencyKey });
  }, [restored, sent, slug, units, formToken, step, draft, photos, idempotencyKey]);

  const { project, errors: localErrors, origin } = useMemo(() => toProject(draft, units), [draft, units]);
  const latestKey = project ? JSON.stringify({ project, photos: photos.length }) : null;
  const requestKey = useDebounced(latestKey, 400);
  const live = useSWR(requestKey ? ['estimate', slug, requestKey] : null, ([, , key]) => fetchEstimate(slug, formToken, JSON.parse(key).project), {
    keepPreviousData: true,
    revalidateOnFocus: false,
    // api.ts makes the one automatic retry inside its own time limit; after that the homeowner decides.
    shouldRetryOnError: false,
  });
  const liveError = live.error ? (live.error instanceof ApiError ? live.error : new ApiError('Something went wrong. Please try again.', 0)) : null;
  const serverErrors = liveError ? normaliseServerErrors(liveError.fields, origin, draft) : {};
  // What stops the range (unanswered questions do not: the range is priced cautiously until then).
  const blockingErrors = { ...serverErrors, ...localErrors };
  // What Send was refused for on earlier steps, shown beside those answers until they change.
  const [refusedAnswers, setRefusedAnswers] = useState<{ draft: Draft; fields: Record<string, string> } | null>(null);
  const sendFieldErrors = refusedAnswers?.draft === draft ? refusedAnswers.fields : {};
  const errors = { ...sendFieldErrors, ...blockingErrors, ...unansweredQuestions(draft) };
  const estimate = project && !liveError ? live.data : undefined;
  // Shown dimmed while the answers on screen are newer than the range.
  const updating = latestKey !== requestKey || live.isValidating;
  // Every error path is the draft's own by now (server paths are mapped back to the walls on
  // screen), so walls are named as the homeowner saw them on the rooms step.
  const waitingContext = useMemo(() => draftWaitingContext(draft, units), [draft, units]);
  const waiting = waitingFor(blockingErrors, waitingContext);
  const liveState: LiveRangeState = estimate
    ? { kind: 'range', estimate, updating }
    : waiting
      ? { kind: 'waiting', what: waiting }
      : liveError
        ? { kind: 'failed', error: liveError }
        : project
          ? { kind: 'working' }
          : { kind: 'empty' };
  const retry = () => void live.mutate();

  // A restored token the server no longer takes: go on with this page's own (its photos stay behind).
  const tokenRefused = Boolean(liveError?.fields.formToken ?? sendError?.fields.formToken);
  useEffect(() => {
    if (tokenRefused && formToken !== freshToken) {
      setFormToken(freshToken);
      setPhotos([]);
      setSendError(null);
    }
  }, [tokenRefused, formToken, freshToken]);

  useEffect(() => {
    headingRef.current?.focus();
    if (step >= 1) {
      void loadPhotoPicker();
      void loadContactStep();
    }
    if (STEPS[step]?.id === 'contact') void loadVisitStep();
  }, [step, sent]);

  const stepErrorKeys: Record<(typeof STEPS)[number]['id'], (path: string) => boolean> = {
    rooms: (p) => fieldStep(p) === 'rooms',
    treatment: (p) => fieldStep(p) === 'treatment',
    options: (p) => fieldStep(p) === 'options',
    photos: () => false,
    result: () => false,
    contact: () => false,
  };
  const current = STEPS[step]!;
  const stepHasErrors = Object.keys(errors).some(stepErrorKeys[current.id]);
  const stepWaiting = waitingFor(Object.fromEntries(Object.entries(errors).filter(([path]) => stepErrorKeys[current.id](path))), waitingContext);
  /** Opens the step that asks the question a field path names, with its messages shown. */
  const goToAnswer = (paths: string[]) => {
    const normalised = Object.keys(normaliseServerErrors(Object.fromEntries(paths.map((p) => [p, '']))));
    const target = STEPS.findIndex((s) => normalised.some(stepErrorKeys[s.id]));
    if (target < 0) return;
    setShowErrors(true);
    setStep(target);
  };

  const next = () => {
    if (stepHasErrors) {
      setShowErrors(true);
      setRefusals((n) => n + 1);
      return;
    }
    setShowErrors(false);
    setStep((s) => Math.min(s + 1, STEPS.length - 1));
  };

  const send = async (contact: ContactInput, website: string) => {
    if (!project || Object.keys(unansweredQuestions(draft)).length) return;
    setSending(true);
    setSendError(null);
    try {
      setSent(await sendLead(slug, { formToken, idempotencyKey, project, contact, website }));
      clearDraft(tabStorage(), slug);
    } catch (error) {
      const failure = error instanceof ApiError ? error : new ApiError('Something went wrong. Please try again.', 0);
      setSendError(failure);
      const earlier = Object.entries(failure.fields).filter(([path]) => path.startsWith('project.'));
      setRefusedAnswers(earlier.length ? { draft, fields: normaliseServerErrors(Object.fromEntries(earlier)) } : null);
    } finally {
      setSending(false);
    }
  };

  if (sent) {
    return (
      <div ref={contentRef} className="mx-auto max-w-xl space-y-4 p-4" data-testid="thank-you">
        <h2 ref={headingRef} tabIndex={-1} className="text-2xl font-bold outline-none">
          Thank you — it's on its way to {firmName}
        </h2>
        <p>
          Your reference is <strong className="figures">{sent.lead.reference}</strong>. We've sent a copy of your price range to your e-mail.
          {` ${firmName}`} will be in touch to arrange a visit to measure.
        </p>
        {sent.estimate && <p className="figures text-xl font-bold">{sent.estimate.range.text}</p>}
        {sent.lead.viewUrl && (
          <p>
            {/* The estimate opens in a new tab: the thank-you stays inside the firm's page. */}
            <a href={sent.lead.viewUrl} target="_blank" rel="noopener" className="font-medium underline">
              See your estimate, with drawings of each wall
            </a>
          </p>
        )}
        {sent.lead.viewUrl && (
          <Suspense fallback={null}>
            <VisitStep slug={slug} viewUrl={sent.lead.viewUrl} firmName={firmName} />
          </Suspense>
        )}
        {firmPhone && (
          <p>
            Questions? Call {firmName} on{' '}
            <a href={`tel:${firmPhone.replace(/\s/g, '')}`} className="figures font-medium underline">
              {firmPhone}
            </a>
            .
          </p>
        )}
      </div>
    );
  }

  const visibleErrors = showErrors ? errors : { ...sendFieldErrors, ...serverErrors };
  return (
    <div ref={contentRef} className="mx-auto max-w-xl p-4 pb-0">
      <div className="flex flex-wrap items-baseline justify-between gap-x-3 text-sm text-slate">
        <p>
          Step {step + 1} of {STEPS.length}
        </p>
        {/* A copy of the range at the top, for a step taller than the screen; the bar below announces it. */}
        {current.id !== 'result' && (
          <p aria-hidden="true" data-testid="live-range-top">
            <LiveRange state={liveState} onRetry={retry} compact />
          </p>
        )}
      </div>
      <h2 ref={headingRef} tabIndex={-1} className="mt-1 text-2xl font-bold outline-none">
        {current.title}
      </h2>
      <div className="mt-4" ref={stepRef}>
        {current.id === 'rooms' && <RoomsStep rooms={draft.rooms} units={units} errors={visibleErrors} onChange={(rooms) => setDraft({ ...draft, rooms })} />}
        {current.id === 'treatment' && (
          <TreatmentStep treatments={treatments} units={units} draft={draft} errors={visibleErrors} onChange={(patch) => setDraft({ ...draft, ...patch })} />
        )}
        {current.id === 'options' && (
          <OptionsStep
            draft={draft}
            errors={visibleErrors}
            onChange={(patch) => setDraft({ ...draft, ...patch })}
            onRoomsChange={(rooms) => setDraft({ ...draft, rooms })}
          />
        )}
        {current.id === 'photos' && (
          <div className="space-y-3">
            <p className="text-slate">Photos of the walls help {firmName} give you a tighter range. Up to 10, optional.</p>
            <Suspense fallback={<p role="status">Getting the photo picker ready…</p>}>
              <PhotoPicker key={formToken} slug={slug} formToken={formToken} initial={photos} onChange={setPhotos} onBusyChange={setPhotosBusy} />
            </Suspense>
          </div>
        )}
        {current.id === 'result' &&
          (estimate ? (
            <ResultView estimate={estimate} firmName={firmName} updating={updating} />
          ) : (
            <div role="status" className="space-y-3" data-testid="result-status">
              {liveState.kind === 'waiting' ? (
                <>
                  <p>Your range is waiting for {liveState.what}.</p>
                  <button type="button" className="button-quiet" onClick={() => goToAnswer(Object.keys(blockingErrors))}>
                    Go to that answer
                  </button>
                </>
              ) : liveState.kind === 'failed' ? (
                <>
                  <p>{liveState.error.message}</p>
                  {liveState.error.retryable && (
                    <button type="button" className="button-quiet" onClick={retry}>
                      Try again
                    </button>
                  )}
                </>
              ) : (
                <p>Working out your range…</p>
              )}
            </div>
          ))}
        {current.id === 'contact' && (
          <>
            <p className="mb-4 text-slate">Leave your details and {firmName} will call to arrange a visit. No obligation.</p>
            <Suspense fallback={<p role="status">Getting the form ready…</p>}>
              <ContactStep firmName={firmName} sending={sending} serverErrors={sendError?.fields ?? {}} onSubmit={send} />
            </Suspense>
            {sendError && <SendProblem error={sendError} context={waitingContext} onGoToAnswer={goToAnswer} />}
          </>
        )}
      </div>

      {showErrors && stepHasErrors && (
        <p role="alert" className="field-error mt-4">
          Some answers on this step need another look{stepWaiting ? `: ${stepWaiting}` : ''}.
        </p>
      )}

      {/* The range and the step's main action together: at the foot of the frame when it is as tall
          as its content, held at the foot of the screen when the frame scrolls (floating panel, direct visit). */}
      <div className="sticky bottom-0 -mx-4 mt-6 border-t border-slate/30 bg-paper/95 px-4 py-3">
        {current.id !== 'result' && (
          <p className="mb-2 text-center" aria-live="polite" data-testid="live-range">
            <LiveRange state={liveState} onRetry={retry} />
          </p>
        )}
        <nav className="flex gap-3" aria-label="Steps">
          {step > 0 && (
            <button type="button" className="button-quiet flex-1" onClick={() => setStep(step - 1)}>
              Back
            </button>
          )}
          {current.id !== 'contact' && (
            <button
              type="button"
              className="flex-1 rounded-md bg-[var(--brand)] px-4 py-2 font-medium text-[var(--brand-text)] disabled:opacity-60"
              disabled={current.id === 'photos' && photosBusy}
              onClick={next}
            >
              {current.id === 'photos' && photosBusy ? 'Photos still uploading…' : current.id === 'result' ? `Send it to ${firmName}` : 'Next'}
            </button>
          )}
        </nav>
      </div>
    </div>
  );
}

/** Why Send failed, in words the homeowner can act on; earlier answers are named and one tap away. */
function SendProblem({ error, context, onGoToAnswer }: { error: ApiError; context: WaitingContext; onGoToAnswer: (paths: string[]) => void }) {
  const earlier = Object.keys(error.fields).filter((k) => !k.startsWith('contact.') && k !== 'website');
  const what = waitingFor(Object.fromEntries(earlier.map((k) => [k, error.fields[k]!])), context);
  return (
    <div role="alert" className="mt-3 space-y-2">
      <p className="field-error">{what ? `One of the earlier answers needs another look: ${what}.` : error.message}</p>
      {what && (
        <button type="button" className="button-quiet" onClick={() => onGoToAnswer(earlier)}>
          Go to that answer
        </button>
      )}
    </div>
  );
}
