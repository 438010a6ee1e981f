/** Log a call to the homeowner: how it went and a short note. Every logged call counts as contact. */
import { useId, useState } from 'react';
import '~/lib/shared/zod-in-browser';
import { CALL_OUTCOMES, CALL_OUTCOME_LABELS, CALL_NOTE_MAX, callSchema, type CallOutcome } from '~/lib/shared/inquiry-work-schemas';
import { announceLeadChanged, sendJson, asRequestFailed, type FormStatus } from './api';
import { StatusLine } from './StatusLine';

export function CallLog({ leadId }: { leadId: string }) {
  const id = useId();
  const [outcome, setOutcome] = useState<CallOutcome | null>(null);
  const [note, setNote] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<FormStatus>(null);
  const [busy, setBusy] = useState(false);

  async function submit(event: React.SyntheticEvent<HTMLFormElement>) {
    event.preventDefault();
    setStatus(null);
    const parsed = callSchema.safeParse({ outcome: outcome ?? undefined, note });
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0] ?? 'outcome'), i.message])));
      return;
    }
    setErrors({});
    setBusy(true);
    try {
      await sendJson('POST', `/api/app/leads/${leadId}/calls`, parsed.data);
      setStatus({ kind: 'done', text: `Call logged: ${CALL_OUTCOME_LABELS[parsed.data.outcome].toLowerCase()}.` });
      setOutcome(null);
      setNote('');
      announceLeadChanged(leadId);
    } catch (error) {
      const failure = asRequestFailed(error);
      setErrors(failure.fields);
      setStatus({ kind: 'failed', text: failure.message });
    } finally {
      setBusy(false);
    }
  }

  return (
    <form onSubmit={submit} noValidate aria-labelledby={`${id}-h`} className="space-y-3">
      <h3 id={`${id}-h`} className="font-bold">
        Log a call
      </h3>
      <fieldset aria-describedby={errors.outcome ? `${id}-outcome-error` : undefined}>
        <legend className="field-label">How did it go?</legend>
        <div className="mt-1 flex flex-wrap gap-2">
          {CALL_OUTCOMES.map((value) => (
            <label key={value} className="flex items-center gap-2 rounded-md border border-slate/40 bg-white px-3 py-1.5 text-sm">
              <input type="radio" name={`${id}-outcome`} value={value} checked={outcome === value} onChange={() => setOutcome(value)} />
              {CALL_OUTCOME_LABELS[value]}
            </label>
          ))}
        </div>
        {errors.outcome && (
          <p id={`${id}-outcome-error`} className="field-error">
            {errors.outcome}
          </p>
        )}
      </fieldset>
      <div>
        <label htmlFor={`${id}-note`} className="field-label">
          What was said (optional)
        </label>
        <textarea
          id={`${id}-note`}
          className="field-input"
          rows={2}
          maxLength={CALL_NOTE_MAX}
          value={note}
          onChange={(e) => setNote(e.target.value)}
          aria-invalid={errors.note ? true : undefined}
          aria-describedby={errors.note ? `${id}-note-error` : undefined}
        />
        {errors.note && (
          <p id={`${id}-note-error`} className="field-error">
            {errors.note}
          </p>
        )}
      </div>
      <p className="text-xs text-slate">
        Every call you log counts as contact for the response time, answered or not: the target is how soon the firm answers.
      </p>
      <div className="flex items-center gap-3">
        <button type="submit" className="button-primary" disabled={busy}>
          Log call
        </button>
        <StatusLine status={status} />
      </div>
    </form>
  );
}
