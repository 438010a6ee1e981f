import { useEffect, useId, useRef, useState } from 'react';
import { LEAD_STAGES, stageLabel, type LeadStage } from '~/lib/shared/labels';
import { NOT_GOING_AHEAD, skipMessage, skippedStages } from '~/lib/shared/stage-rules';
import type { TimelineView } from '~/lib/shared/inquiry-timeline';
import { act, RequestFailed, useInquiryTimeline } from './api';

type Props = {
  leadId: string;
  initial: TimelineView;
  team: { id: string; name: string }[];
  lostReasons: string[];
  /** The viewer's own membership, for "the reminder goes to you". */
  viewerMembershipId: string;
  may: { edit: boolean; assign: boolean };
};

/** What the stage control is asking before it moves: to confirm a skip, or for a reason. */
type Question = { to: LeadStage; kind: 'skip' | 'reason'; message: string } | null;

/** The inquiry page's workflow controls: stage, who has it, and the next follow-up. */
export function InquiryControls({ leadId, initial, team, lostReasons, viewerMembershipId, may }: Props) {
  const { data } = useInquiryTimeline(leadId, initial);
  const state = (data ?? initial).state;
  const ids = useId();
  const [fields, setFields] = useState<Record<string, string>>({});
  const [busy, setBusy] = useState(false);
  const [question, setQuestion] = useState<Question>(null);
  const [reason, setReason] = useState('');
  const [followUp, setFollowUp] = useState(state.nextFollowUpInput ?? '');
  const dialog = useRef<HTMLDialogElement>(null);

  useEffect(() => setFollowUp(state.nextFollowUpInput ?? ''), [state.nextFollowUpInput]);
  useEffect(() => {
    const element = dialog.current;
    if (!element) return;
    if (question && !element.open) element.showModal();
    if (!question && element.open) element.close();
  }, [question]);

  async function run(url: string, method: 'POST' | 'PUT', body: unknown, onRefused?: (error: RequestFailed) => boolean): Promise<boolean> {
    setBusy(true);
    setFields({});
    try {
      await act(leadId, method, url, body);
      return true;
    } catch (error) {
      if (!(error instanceof RequestFailed)) throw error;
      if (!onRefused?.(error)) setFields(Object.keys(error.fields).length ? error.fields : { form: error.message });
      return false;
    } finally {
      setBusy(false);
    }
  }

  async function move(to: LeadStage, extra: { reason?: string; confirm?: boolean } = {}) {
    const moved = await run(`/api/app/leads/${leadId}/stage`, 'POST', { to, ...extra }, (error) => {
      // Someone else moved it meanwhile and this is now a skip: ask, as for any skip.
      if (error.status !== 409) return false;
      setQuestion({ to, kind: 'skip', message: error.fields.to ?? error.message });
      return true;
    });
    if (moved) setQuestion(null);
  }

  function chooseStage(to: LeadStage) {
    if (to === state.stage) return;
    if (to === NOT_GOING_AHEAD) {
      setReason('');
      setQuestion({ to, kind: 'reason', message: 'Why is it not going ahead?' });
      return;
    }
    const skipped = skippedStages(state.stage, to);
    if (skipped.length) setQuestion({ to, kind: 'skip', message: skipMessage(skipped) });
    else void move(to);
  }

  function answer(event: { preventDefault(): void }) {
    event.preventDefault();
    if (!question) return;
    if (question.kind === 'reason') {
      if (!reason) return setFields({ reason: 'Choose why it is not going ahead.' });
      void move(question.to, { reason });
    } else void move(question.to, { confirm: true });
  }

  function saveFollowUp(event: { preventDefault(): void }) {
    event.preventDefault();
    if (!followUp) return setFields({ at: 'Choose a date and time.' });
    void run(`/api/app/leads/${leadId}/follow-up`, 'PUT', { at: followUp });
  }

  const assignee = team.find((m) => m.id === state.assigneeId);
  const remindWho = assignee ? (assignee.id === viewerMembershipId ? 'you' : assignee.name) : 'you';

  return (
    <div className="grid gap-4 rounded border border-slate/20 bg-white p-4 sm:grid-cols-3" data-testid="inquiry-controls">
      <div>
        <label htmlFor={`${ids}-stage`} className="field-label">
          Stage
        </label>
        <select
          id={`${ids}-stage`}
          className="field-input"
          value={state.stage}
          disabled={!may.edit || busy}
          onChange={(e) => chooseStage(e.target.value as LeadStage)}
          aria-describedby={fields.to ? `${ids}-stage-error` : undefined}
        >
          {LEAD_STAGES.map((s) => (
            <option key={s.id} value={s.id}>
              {s.label}
            </option>
          ))}
        </select>
        {state.stage === NOT_GOING_AHEAD && state.lostReason && <p className="mt-1 text-sm text-slate">Reason: {state.lostReason}</p>}
        {fields.to && !question && (
          <p id={`${ids}-stage-error`} className="field-error">
            {fields.to}
          </p>
        )}
      </div>

      <div>
        <label htmlFor={`${ids}-assignee`} className="field-label">
          Assigned to
        </label>
        <select
          id={`${ids}-assignee`}
          className="field-input"
          value={state.assigneeId ?? ''}
          disabled={!may.assign || busy}
          onChange={(e) => void run(`/api/app/leads/${leadId}/assignee`, 'PUT', { membershipId: e.target.value || null })}
          aria-describedby={fields.membershipId ? `${ids}-assignee-error` : undefined}
        >
          <option value="">Nobody yet</option>
          {team.map((m) => (
            <option key={m.id} value={m.id}>
              {m.name}
              {m.id === viewerMembershipId ? ' (you)' : ''}
            </option>
          ))}
        </select>
        {fields.membershipId && (
          <p id={`${ids}-assignee-error`} className="field-error">
            {fields.membershipId}
          </p>
        )}
      </div>

      <form onSubmit={saveFollowUp} noValidate>
        <label htmlFor={`${ids}-follow-up`} className="field-label">
          Next follow-up
        </label>
        <div className="flex gap-2">
          <input
            id={`${ids}-follow-up`}
            type="datetime-local"
            className="field-input"
            value={followUp}
            disabled={!may.edit}
            onChange={(e) => setFollowUp(e.target.value)}
            aria-invalid={fields.at ? true : undefined}
            aria-describedby={`${ids}-follow-up-note${fields.at ? ` ${ids}-follow-up-error` : ''}`}
          />
          <button type="submit" className="button-quiet mt-1 px-3" disabled={!may.edit || busy}>
            Set
          </button>
        </div>
        {fields.at && (
          <p id={`${ids}-follow-up-error`} className="field-error">
            {fields.at}
          </p>
        )}
        <p id={`${ids}-follow-up-note`} className="mt-1 text-xs text-slate" data-testid="follow-up-note">
          {state.nextFollowUpText
            ? `Set for ${state.nextFollowUpText}. A reminder e-mail goes to ${remindWho} then.`
            : 'None set. A reminder e-mail goes out when it comes due.'}
        </p>
        {state.nextFollowUpText && may.edit && (
          <button
            type="button"
            className="mt-1 text-xs text-lapwing underline"
            disabled={busy}
            onClick={() => void run(`/api/app/leads/${leadId}/follow-up`, 'PUT', { at: null })}
          >
            Clear follow-up
          </button>
        )}
      </form>

      {fields.form && (
        <p role="alert" className="field-error sm:col-span-3">
          {fields.form}
        </p>
      )}

      <dialog
        ref={dialog}
        onClose={() => setQuestion(null)}
        className="w-full max-w-md rounded-md border border-slate/30 p-0 backdrop:bg-ink/40"
        aria-labelledby={`${ids}-dialog-title`}
      >
        {question && (
          <form onSubmit={answer} className="space-y-3 p-4">
            <h2 id={`${ids}-dialog-title`} className="font-bold">
              Move to {stageLabel(question.to)}?
            </h2>
            {question.kind === 'skip' ? (
              <p className="text-sm">{question.message}</p>
            ) : (
              <div>
                <label htmlFor={`${ids}-reason`} className="field-label">
                  {question.message}
                </label>
                <select
                  id={`${ids}-reason`}
                  className="field-input"
                  value={reason}
                  onChange={(e) => setReason(e.target.value)}
                  aria-describedby={fields.reason ? `${ids}-reason-error` : undefined}
                >
                  <option value="">Choose a reason…</option>
                  {lostReasons.map((r) => (
                    <option key={r} value={r}>
                      {r}
                    </option>
                  ))}
                </select>
                {fields.reason && (
                  <p id={`${ids}-reason-error`} className="field-error">
                    {fields.reason}
                  </p>
                )}
              </div>
            )}
            {fields.form && <p className="field-error">{fields.form}</p>}
            <div className="flex justify-end gap-2">
              <button type="button" className="button-quiet" onClick={() => setQuestion(null)}>
                Cancel
              </button>
              <button type="submit" className="button-primary" disabled={busy}>
                {question.kind === 'skip' ? 'Move anyway' : `Move to ${stageLabel(question.to)}`}
              </button>
            </div>
          </form>
        )}
      </dialog>
    </div>
  );
}
