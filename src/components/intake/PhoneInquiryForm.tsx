import '~/lib/shared/zod-in-browser';
import { useEffect, useMemo, useRef, useState } from 'react';
import useSWR from 'swr';
import type { ProjectInput, Units } from '~/lib/estimate/index.ts';
import type { HomeownerEstimate } from '~/lib/shared/homeowner-estimate';
import { staffContactSchema } from '~/lib/shared/intake-schemas';
import type { ContactInput } from '~/lib/shared/lead-schemas';
import { ContactStep, type ContactWording } from '../widget/ContactStep';
import { ApiError, ESTIMATE_TIMEOUT_MS, postJson } from '../widget/api';
import { draftWaitingContext, newDraft, normaliseServerErrors, toProject, unansweredQuestions, type Draft } from '../widget/draft';
import { LiveRange, type LiveRangeState } from '../widget/LiveRange';
import { waitingFor } from '../widget/waiting-for';
import { focusFirstError } from '../widget/focus-first-error';
import { OptionsStep } from '../widget/OptionsStep';
import { RoomsStep } from '../widget/RoomsStep';
import { TreatmentStep, type OfferedTreatment } from '../widget/TreatmentStep';

type Props = {
  units: Units;
  treatments: OfferedTreatment[];
  firmName: string;
  /** The firm's colour and the text on it, as the widget's parts expect them. */
  brand: string;
  brandText: string;
};

const STAFF_WORDS: ContactWording = {
  name: "Homeowner's name",
  reach: 'How would they like to be contacted?',
  consent: 'The homeowner agreed on the phone to be contacted about this inquiry.',
  submit: 'Save and price the inquiry',
  sending: 'Saving…',
};

function useDebounced<T>(value: T, ms: number): T {
  const [current, setCurrent] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setCurrent(value), ms);
    return () => clearTimeout(timer);
  }, [value, ms]);
  return current;
}

const fetchStaffEstimate = (project: ProjectInput) =>
  postJson<{ estimate: HomeownerEstimate }>('/api/app/leads/estimate', { project }, { timeoutMs: ESTIMATE_TIMEOUT_MS, retries: 1 }).then((d) => d.estimate);

/**
 * A phone inquiry, typed in by staff: the price widget's own room, finish and detail forms on one
 * page, then the homeowner's details. The server prices it with the firm's Rate book, exactly as
 * for the widget, and the inquiry page opens with the estimate.
 */
export default function PhoneInquiryForm({ units, treatments, firmName, brand, brandText }: Props) {
  const [draft, setDraft] = useState<Draft>(() => ({ ...newDraft(units), treatmentId: treatments.length === 1 ? treatments[0]!.id : null }));
  const [showErrors, setShowErrors] = useState(false);
  const [sending, setSending] = useState(false);
  const [serverFields, setServerFields] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState<string | null>(null);
  // One key per form: a double click or a retried save makes one inquiry.
  const [idempotencyKey] = useState(() => crypto.randomUUID());
  const formRef = useRef<HTMLDivElement>(null);

  const { project, errors: localErrors, origin } = useMemo(() => toProject(draft, units), [draft, units]);
  const projectErrors = { ...localErrors, ...unansweredQuestions(draft) };

  // The live range, as the widget shows it: the same estimate of the rooms typed so far.
  const latestKey = project ? JSON.stringify(project) : null;
  const requestKey = useDebounced(latestKey, 400);
  const live = useSWR(requestKey ? ['staff-estimate', requestKey] : null, ([, key]) => fetchStaffEstimate(JSON.parse(key)), {
    keepPreviousData: true,
    revalidateOnFocus: false,
    shouldRetryOnError: false,
  });
  const liveError = live.error ? (live.error instanceof ApiError ? live.error : new ApiError('Something went wrong. Please try again.', 0)) : null;
  const liveFieldErrors = liveError ? normaliseServerErrors(liveError.fields, origin, draft) : {};
  const waiting = waitingFor({ ...liveFieldErrors, ...localErrors }, draftWaitingContext(draft, units));
  const liveState: LiveRangeState =
    project && live.data && !liveError
      ? { kind: 'range', estimate: live.data, updating: latestKey !== requestKey || live.isValidating }
      : waiting
        ? { kind: 'waiting', what: waiting }
        : liveError
          ? { kind: 'failed', error: liveError }
          : project
            ? { kind: 'working' }
            : { kind: 'empty' };

  const serverProjectErrors = {
    ...liveFieldErrors,
    ...normaliseServerErrors(Object.fromEntries(Object.entries(serverFields).filter(([path]) => path.startsWith('project.'))), origin, draft),
  };
  const visibleErrors = showErrors ? { ...serverProjectErrors, ...projectErrors } : serverProjectErrors;
  const contactErrors = Object.fromEntries(Object.entries(serverFields).filter(([path]) => path.startsWith('contact.')));

  const save = async (contact: ContactInput) => {
    if (!project || Object.keys(projectErrors).length) {
      setShowErrors(true);
      setProblem('Some answers about the rooms need another look.');
      requestAnimationFrame(() => focusFirstError(formRef.current));
      return;
    }
    setSending(true);
    setProblem(null);
    try {
      const response = await fetch('/api/app/leads', {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ idempotencyKey, project, contact }),
      });
      const answer = (await response.json().catch(() => ({}))) as { lead?: { url: string }; error?: string; fields?: Record<string, string> };
      if (response.ok && answer.lead) {
        window.location.assign(answer.lead.url);
        return;
      }
      setServerFields(answer.fields ?? {});
      setShowErrors(true);
      setProblem(answer.error ?? 'The inquiry was not saved. Please try again.');
    } catch {
      setProblem('We could not reach Lapwing. Check the connection and try again.');
    } finally {
      setSending(false);
    }
  };

  return (
    <div ref={formRef} className="max-w-2xl space-y-8" style={{ '--brand': brand, '--brand-text': brandText } as React.CSSProperties}>
      <section aria-labelledby="phone-rooms-h">
        <h2 id="phone-rooms-h" className="text-lg font-bold">
          Rooms
        </h2>
        <div className="mt-3">
          <RoomsStep rooms={draft.rooms} units={units} errors={visibleErrors} onChange={(rooms) => setDraft({ ...draft, rooms })} />
        </div>
      </section>
      <section aria-labelledby="phone-finish-h">
        <h2 id="phone-finish-h" className="text-lg font-bold">
          Finish and height
        </h2>
        <div className="mt-3">
          <TreatmentStep treatments={treatments} units={units} draft={draft} errors={visibleErrors} onChange={(patch) => setDraft({ ...draft, ...patch })} />
        </div>
      </section>
      <section aria-labelledby="phone-details-h">
        <h2 id="phone-details-h" className="text-lg font-bold">
          Details
        </h2>
        <div className="mt-3">
          <OptionsStep
            draft={draft}
            errors={visibleErrors}
            onChange={(patch) => setDraft({ ...draft, ...patch })}
            onRoomsChange={(rooms) => setDraft({ ...draft, rooms })}
          />
        </div>
      </section>
      <section aria-labelledby="phone-contact-h">
        <h2 id="phone-contact-h" className="text-lg font-bold">
          Homeowner
        </h2>
        <div className="mt-3">
          <ContactStep
            firmName={firmName}
            sending={sending}
            serverErrors={contactErrors}
            onSubmit={(contact) => void save(contact)}
            wording={STAFF_WORDS}
            schema={staffContactSchema}
          />
        </div>
        {problem && (
          <p role="alert" className="field-error mt-3">
            {problem}
          </p>
        )}
      </section>
      <div className="sticky bottom-0 border-t border-slate/30 bg-paper/95 py-3 text-center" aria-live="polite" data-testid="live-range">
        <LiveRange state={liveState} onRetry={() => void live.mutate()} />
      </div>
    </div>
  );
}
