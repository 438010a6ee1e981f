/**
 * The rooms as measured on the site visit, in the price widget's own room, finish and detail
 * forms, starting from the rooms the inquiry holds (the homeowner's, or an earlier measurement).
 * Saving re-prices the inquiry as a site measurement and moves it to Measured; the page loads
 * again to show the new range, and the earlier one stays in the history.
 */
import '~/lib/shared/zod-in-browser';
import { useId, useMemo, useRef, useState } from 'react';
import type { ProjectInput, Units } from '~/lib/estimate/index.ts';
import type { MeasuredRoomsRequest } from '~/lib/shared/measured-rooms-schemas';
import { normaliseServerErrors, toProject, unansweredQuestions, type Draft } from '../../widget/draft';
import { draftFromProject } from '../../widget/draft-from-project';
import { focusFirstError } from '../../widget/focus-first-error';
import { OptionsStep } from '../../widget/OptionsStep';
import { RoomsStep } from '../../widget/RoomsStep';
import { TreatmentStep, type OfferedTreatment } from '../../widget/TreatmentStep';
import { asRequestFailed, sendJson, type FormStatus } from './api';
import { StatusLine } from './StatusLine';
import { useHydrated } from '../../use-hydrated';

type Props = {
  leadId: string;
  units: Units;
  treatments: OfferedTreatment[];
  /** The rooms the inquiry holds now, as stored. */
  rooms: ProjectInput;
  /** Which visit was done, e.g. "Tue, Dec 1, 2026, 9:00 AM CST with Sam Okafor". */
  visitText: string;
  /** Whether the rooms held now are already a site measurement. */
  measured: boolean;
  brand: string;
  brandText: string;
};

export function MeasuredRooms({ leadId, units, treatments, rooms, visitText, measured, brand, brandText }: Props) {
  const id = useId();
  const [open, setOpen] = useState(false);
  const hydrated = useHydrated();
  const [draft, setDraft] = useState<Draft>(() => draftFromProject(rooms, units));
  const [showErrors, setShowErrors] = useState(false);
  const [serverFields, setServerFields] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<FormStatus>(null);
  const [busy, setBusy] = useState(false);
  const formRef = useRef<HTMLFormElement>(null);

  const { project, errors: localErrors, origin } = useMemo(() => toProject(draft, units), [draft, units]);
  const projectErrors = { ...localErrors, ...unansweredQuestions(draft) };
  const serverErrors = normaliseServerErrors(serverFields, origin, draft);
  const visibleErrors = showErrors ? { ...serverErrors, ...projectErrors } : serverErrors;

  async function save(event: React.SyntheticEvent<HTMLFormElement>) {
    event.preventDefault();
    setStatus(null);
    if (!project || Object.keys(projectErrors).length) {
      setShowErrors(true);
      setStatus({ kind: 'failed', text: 'Some answers about the rooms need another look.' });
      requestAnimationFrame(() => focusFirstError(formRef.current));
      return;
    }
    setBusy(true);
    try {
      const body: MeasuredRoomsRequest = { project: { ...project, measuredBy: 'site-measure' } };
      await sendJson('PUT', `/api/app/leads/${leadId}/measured-rooms`, body);
      window.location.reload();
    } catch (error) {
      const failure = asRequestFailed(error);
      setServerFields(failure.fields);
      setShowErrors(true);
      setStatus({ kind: 'failed', text: failure.message });
      requestAnimationFrame(() => focusFirstError(formRef.current));
    } finally {
      setBusy(false);
    }
  }

  return (
    <section aria-labelledby={`${id}-h`} className="rounded border border-slate/20 bg-white p-4" data-testid="measured-rooms">
      <h2 id={`${id}-h`} className="font-bold">
        Measured rooms
      </h2>
      <p className="mt-1 text-sm text-slate">
        Site visit done: {visitText}.{' '}
        {measured
          ? 'The estimate is priced from a site measurement; correct the rooms here if needed.'
          : 'Enter the rooms as you measured them. They start as the homeowner described them; saving re-prices the inquiry from a site measurement and moves it to Measured.'}
      </p>
      {!open ? (
        <button type="button" className="button-primary mt-3 px-3 py-1.5" onClick={() => setOpen(true)} disabled={!hydrated}>
          {measured ? 'Correct the measured rooms' : 'Enter the measured rooms'}
        </button>
      ) : (
        <form
          ref={formRef}
          onSubmit={(event) => void save(event)}
          noValidate
          className="mt-4 max-w-2xl space-y-8"
          style={{ '--brand': brand, '--brand-text': brandText } as React.CSSProperties}
        >
          <section aria-labelledby={`${id}-rooms-h`}>
            <h3 id={`${id}-rooms-h`} className="font-bold">
              Rooms
            </h3>
            <div className="mt-3">
              <RoomsStep rooms={draft.rooms} units={units} errors={visibleErrors} onChange={(rooms) => setDraft({ ...draft, rooms })} />
            </div>
          </section>
          <section aria-labelledby={`${id}-finish-h`}>
            <h3 id={`${id}-finish-h`} className="font-bold">
              Finish and height
            </h3>
            <div className="mt-3">
              <TreatmentStep
                treatments={treatments}
                units={units}
                draft={draft}
                errors={visibleErrors}
                onChange={(patch) => setDraft({ ...draft, ...patch })}
              />
            </div>
          </section>
          <section aria-labelledby={`${id}-details-h`}>
            <h3 id={`${id}-details-h`} className="font-bold">
              Details
            </h3>
            <div className="mt-3">
              <OptionsStep
                draft={draft}
                errors={visibleErrors}
                askHowMeasured={false}
                onChange={(patch) => setDraft({ ...draft, ...patch })}
                onRoomsChange={(rooms) => setDraft({ ...draft, rooms })}
              />
            </div>
          </section>
          <div className="flex flex-wrap items-center gap-3">
            <button type="submit" className="button-primary px-4 py-2" disabled={busy}>
              {busy ? 'Pricing…' : 'Save the measured rooms and re-price'}
            </button>
            <button type="button" className="button-quiet px-3 py-2" disabled={busy} onClick={() => setOpen(false)}>
              Close
            </button>
          </div>
          <StatusLine status={status} />
        </form>
      )}
    </section>
  );
}
