import { Suspense, lazy, useEffect, useMemo, useRef, useState } from 'react';
import useSWR from 'swr';
import type { Units } from '~/lib/estimate/index.ts';
import type { ContactInput } from '~/lib/shared/lead-schemas';
import { ApiError, fetchEstimate, sendLead, type SentLead } from './api';
import { fieldStep, newDraft, normaliseServerErrors, toProject, unansweredQuestions, type Draft } from './draft';
import { focusFirstError } from './focus-first-error';
import { OptionsStep } from './OptionsStep';
import { ResultView } from './ResultView';
import { RoomsStep } from './RoomsStep';
import { TreatmentStep, type OfferedTreatment } from './TreatmentStep';

// The photo and contact steps carry the heavier libraries (dropzone, form validation, phone
// numbers); they load in the background once the homeowner is past the first step.
const loadContactStep = () => import('./ContactStep');
const loadPhotoPicker = () => import('./PhotoPicker');
const ContactStep = lazy(() => loadContactStep().then((module) => ({ default: module.ContactStep })));
const PhotoPicker = lazy(loadPhotoPicker);

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

/** Tells the embedding page how tall we are, so its iframe never scrolls. */
function useReportHeight(hostOrigin: string | null) {
  useEffect(() => {
    if (!hostOrigin || window.parent === window) return;
    const report = () => window.parent.postMessage({ type: 'lapwing:height', height: Math.ceil(document.documentElement.scrollHeight) }, hostOrigin);
    const observer = new ResizeObserver(report);
    observer.observe(document.body);
    report();
    return () => observer.disconnect();
  }, [hostOrigin]);
}

export default function PriceWidget({ slug, formToken, firmName, firmPhone = null, units, treatments, hostOrigin }: PriceWidgetProps) {
  const [draft, setDraft] = useState<Draft>(() => ({ ...newDraft(units), treatmentId: treatments.length === 1 ? treatments[0]!.id : null }));
  const [step, setStep] = useState(0);
  const [photos, setPhotos] = useState<{ id: string; thumbnailUrl: string }[]>([]);
  const [photosBusy, setPhotosBusy] = useState(false);
  const [showErrors, setShowErrors] = useState(false);
  const [sending, setSending] = useState(false);
  const [sendError, setSendError] = useState<ApiError | null>(null);
  const [sent, setSent] = useState<SentLead | null>(null);
  // One key per widget visit: a double tap or a retried send makes one lead.
  const idempotencyKey = useMemo(() => crypto.randomUUID(), []);
  const headingRef = useRef<HTMLHeadingElement>(null);
  // Counts refused Next presses, so each one moves focus to the first answer to fix.
  const stepRef = useRef<HTMLDivElement>(null);
  const [refusals, setRefusals] = useState(0);
  useEffect(() => {
    if (refusals > 0) focusFirstError(stepRef.current);
  }, [refusals]);
  useReportHeight(hostOrigin);

  const { project, errors: localErrors, origin } = useMemo(() => toProject(draft, units), [draft, units]);
  const latestKey = project ? JSON.stringify({ project, photos: photos.length }) : null;
  const requestKey = useDebounced(latestKey, 400);
  const live = useSWR(requestKey ? ['estimate', slug, requestKey] : null, ([, , key]) => fetchEstimate(slug, formToken, JSON.parse(key).project), {
    keepPreviousData: true,
    revalidateOnFocus: false,
    shouldRetryOnError: false,
  });
  const serverErrors = live.error instanceof ApiError ? normaliseServerErrors(live.error.fields, origin, draft) : {};
  const errors = { ...serverErrors, ...localErrors, ...unansweredQuestions(draft) };
  const estimate = project && !live.error ? live.data : undefined;
  // Shown dimmed while the answers on screen are newer than the range.
  const updating = latestKey !== requestKey || live.isValidating;

  useEffect(() => {
    headingRef.current?.focus();
    if (step >= 1) {
      void loadPhotoPicker();
      void loadContactStep();
    }
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
    } catch (error) {
      setSendError(error instanceof ApiError ? error : new ApiError('Something went wrong. Please try again.', 0));
    } finally {
      setSending(false);
    }
  };

  if (sent) {
    return (
      <div className="mx-auto max-w-xl space-y-4 p-4">
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

  const visibleErrors = showErrors ? errors : serverErrors;
  return (
    <div className="mx-auto max-w-xl p-4 pb-28">
      <p className="text-sm text-slate">
        Step {step + 1} of {STEPS.length}
      </p>
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
              <PhotoPicker slug={slug} formToken={formToken} onChange={setPhotos} onBusyChange={setPhotosBusy} />
            </Suspense>
          </div>
        )}
        {current.id === 'result' &&
          (estimate ? (
            <ResultView estimate={estimate} firmName={firmName} updating={updating} />
          ) : (
            <p role="status">{project ? 'Working out your range…' : 'Some answers need another look before we can work out a range.'}</p>
          ))}
        {current.id === 'contact' && (
          <>
            <p className="mb-4 text-slate">Leave your details and {firmName} will call to arrange a visit. No obligation.</p>
            <Suspense fallback={<p role="status">Getting the form ready…</p>}>
              <ContactStep firmName={firmName} sending={sending} serverErrors={sendError?.fields ?? {}} onSubmit={send} />
            </Suspense>
            {sendError && (
              <p role="alert" className="field-error mt-3">
                {sendError.status === 400 && Object.keys(sendError.fields).some((k) => !k.startsWith('contact.'))
                  ? 'Some earlier answers need another look. '
                  : ''}
                {sendError.message}
              </p>
            )}
          </>
        )}
      </div>

      {showErrors && stepHasErrors && (
        <p role="alert" className="field-error mt-4">
          Some answers on this step need another look.
        </p>
      )}

      <nav className="mt-6 flex gap-3" aria-label="Steps">
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

      {current.id !== 'result' && (
        <div className="fixed inset-x-0 bottom-0 border-t border-slate/30 bg-paper/95 px-4 py-3 text-center" aria-live="polite" data-testid="live-range">
          {estimate ? (
            <>
              <span className="text-sm text-slate">Price range so far: </span>
              <span className="figures text-lg font-bold">{estimate.range.text}</span>
            </>
          ) : (
            <span className="text-sm text-slate">{live.isLoading ? 'Working out your range…' : 'Your range appears here as you answer.'}</span>
          )}
        </div>
      )}
    </div>
  );
}
