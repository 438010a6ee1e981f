import '~/lib/shared/zod-in-browser';
import { useMemo, useRef, useState } from 'react';
import type { Units } from '~/lib/estimate/index.ts';
import { staffContactSchema } from '~/lib/shared/intake-schemas';
import type { ContactInput } from '~/lib/shared/lead-schemas';
import { ContactStep, type ContactWording } from '../widget/ContactStep';
import { newDraft, normaliseServerErrors, toProject, unansweredQuestions, type Draft } from '../widget/draft';
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
  const serverProjectErrors = normaliseServerErrors(
    Object.fromEntries(Object.entries(serverFields).filter(([path]) => path.startsWith('project.'))),
    origin,
    draft,
  );
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
    </div>
  );
}
