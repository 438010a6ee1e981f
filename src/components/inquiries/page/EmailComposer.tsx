/**
 * E-mail the homeowner from one of the firm's templates: pick one, read it filled in, change what
 * needs changing, send. `{estimate_link}` stays as written until it is sent, when the server puts in
 * a private link made for this e-mail. The message goes through the app's mail queue and is kept
 * on the inquiry's timeline.
 */
import { useId, useState } from 'react';
import '~/lib/shared/zod-in-browser';
import { fillPlaceholders, type PlaceholderValues } from '~/lib/shared/mail-placeholders';
import { BODY_MAX, leadEmailSchema, SUBJECT_MAX, type MailTemplateView } from '~/lib/shared/inquiry-work-schemas';
import { announceLeadChanged, sendJson, asRequestFailed, type FormStatus } from './api';
import { StatusLine } from './StatusLine';

type Props = {
  leadId: string;
  to: string;
  templates: MailTemplateView[];
  /** Everything but the estimate link, which exists only once the e-mail is sent. */
  values: Omit<PlaceholderValues, 'estimate_link'>;
  /** Owners may edit the templates: the page links them to the screen. */
  templatesHref?: string;
};

export function EmailComposer({ leadId, to, templates, values, templatesHref }: Props) {
  const id = useId();
  const [templateId, setTemplateId] = useState('');
  const [subject, setSubject] = useState('');
  const [body, setBody] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<FormStatus>(null);
  const [busy, setBusy] = useState(false);

  function choose(nextId: string) {
    setTemplateId(nextId);
    const template = templates.find((t) => t.id === nextId);
    if (!template) return;
    setSubject(fillPlaceholders(template.subject, values));
    setBody(fillPlaceholders(template.body, values));
    setErrors({});
    setStatus(null);
  }

  async function submit(event: React.SyntheticEvent<HTMLFormElement>) {
    event.preventDefault();
    setStatus(null);
    const parsed = leadEmailSchema.safeParse({ templateId: templateId || null, subject, body });
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
      return;
    }
    setErrors({});
    setBusy(true);
    try {
      await sendJson('POST', `/api/app/leads/${leadId}/emails`, parsed.data);
      setStatus({ kind: 'done', text: `E-mail to ${to} is on its way. A copy is kept on the timeline.` });
      setTemplateId('');
      setSubject('');
      setBody('');
      announceLeadChanged(leadId);
    } catch (failure) {
      const problem = asRequestFailed(failure);
      setErrors(problem.fields);
      setStatus({ kind: 'failed', text: problem.message });
    } finally {
      setBusy(false);
    }
  }

  const fieldError = (name: string) =>
    errors[name] ? (
      <p id={`${id}-${name}-error`} className="field-error">
        {errors[name]}
      </p>
    ) : null;

  return (
    <form onSubmit={submit} noValidate aria-labelledby={`${id}-h`} className="space-y-3">
      <h3 id={`${id}-h`} className="font-bold">
        E-mail the homeowner
      </h3>
      <p className="text-sm text-slate">
        To <span className="font-medium text-ink">{to}</span>, in your firm’s name; replies come back to the firm.
      </p>
      <div>
        <label htmlFor={`${id}-template`} className="field-label">
          Start from a template
        </label>
        <select id={`${id}-template`} className="field-input" value={templateId} onChange={(e) => choose(e.target.value)}>
          <option value="">Choose a template…</option>
          {templates.map((t) => (
            <option key={t.id} value={t.id}>
              {t.name}
            </option>
          ))}
        </select>
        {templatesHref && (
          <p className="mt-1 text-xs">
            <a href={templatesHref}>Edit the templates</a>
          </p>
        )}
      </div>
      <div>
        <label htmlFor={`${id}-subject`} className="field-label">
          Subject
        </label>
        <input
          id={`${id}-subject`}
          className="field-input"
          maxLength={SUBJECT_MAX}
          value={subject}
          onChange={(e) => setSubject(e.target.value)}
          aria-invalid={errors.subject ? true : undefined}
          aria-describedby={errors.subject ? `${id}-subject-error` : undefined}
        />
        {fieldError('subject')}
      </div>
      <div>
        <label htmlFor={`${id}-body`} className="field-label">
          Message
        </label>
        <textarea
          id={`${id}-body`}
          className="field-input font-mono text-sm"
          rows={10}
          maxLength={BODY_MAX}
          value={body}
          onChange={(e) => setBody(e.target.value)}
          aria-invalid={errors.body ? true : undefined}
          aria-describedby={`${id}-body-hint${errors.body ? ` ${id}-body-error` : ''}`}
        />
        <p id={`${id}-body-hint`} className="mt-1 text-xs text-slate">
          <code>{'{estimate_link}'}</code> becomes a private link to the homeowner’s estimate when you send.
        </p>
        {fieldError('body')}
      </div>
      <div className="flex items-center gap-3">
        <button type="submit" className="button-primary" disabled={busy}>
          Send e-mail
        </button>
        <StatusLine status={status} />
      </div>
    </form>
  );
}
