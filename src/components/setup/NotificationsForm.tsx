import '~/lib/shared/zod-in-browser';
import { useEffect, useId, useState } from 'react';
import { fieldsFromZod } from '~/lib/estimate/errors.ts';
import { notificationsSchema, type Notifications } from '~/lib/shared/setup-schemas';
import { asRequestFailed, sendJson, type FormStatus } from '~/components/inquiries/page/api';
import { StatusLine } from '~/components/inquiries/page/StatusLine';

type Props = { initial: Notifications };

const addressesOf = (text: string) => text.split(/[\s,;]+/).filter((address) => address !== '');

/** Working minutes as people say them: 240 → "4 working hours", 90 → "1 working hour 30 minutes". */
export function workingTimeText(minutes: number): string {
  if (!Number.isInteger(minutes) || minutes < 0) return '';
  const hours = Math.floor(minutes / 60);
  const rest = minutes % 60;
  const parts = [hours ? `${hours} working hour${hours === 1 ? '' : 's'}` : '', rest ? `${rest} minute${rest === 1 ? '' : 's'}` : ''].filter(Boolean);
  return parts.join(' ') || '0 minutes';
}

/** Further addresses for new-inquiry e-mails and the response target (Setup → Notifications). */
export function NotificationsForm({ initial }: Props) {
  const ids = useId();
  const [emails, setEmails] = useState(initial.extraEmails.join(', '));
  const [target, setTarget] = useState(String(initial.responseTargetMinutes));
  const [fields, setFields] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<FormStatus>(null);
  const [saving, setSaving] = useState(false);
  const [ready, setReady] = useState(false);
  useEffect(() => setReady(true), []);

  async function save(event: { preventDefault(): void }) {
    event.preventDefault();
    setStatus(null);
    const body = { extraEmails: addressesOf(emails), responseTargetMinutes: target.trim() === '' ? NaN : Number(target) };
    const checked = notificationsSchema.safeParse(body);
    if (!checked.success) {
      setFields(fieldsFromZod(checked.error));
      setStatus({ kind: 'failed', text: 'Some fields need attention.' });
      return;
    }
    setSaving(true);
    try {
      const saved = await sendJson<Notifications>('PUT', '/api/app/settings/notifications', checked.data);
      setEmails(saved.extraEmails.join(', '));
      setFields({});
      setStatus({ kind: 'done', text: 'Saved.' });
    } catch (error) {
      const failed = asRequestFailed(error);
      setFields(failed.fields);
      setStatus({ kind: 'failed', text: failed.message });
    } finally {
      setSaving(false);
    }
  }

  const emailError = Object.entries(fields).find(([path]) => path.startsWith('extraEmails'));
  const emailMessage =
    emailError && (emailError[0] === 'extraEmails' ? emailError[1] : `“${addressesOf(emails)[Number(emailError[0].split('.')[1])] ?? ''}”: ${emailError[1]}`);
  const minutes = Number(target);

  return (
    <form onSubmit={save} noValidate className="mt-4 max-w-lg space-y-4" data-ready={ready ? 'true' : undefined}>
      <div>
        <label htmlFor={`${ids}-emails`} className="field-label">
          Also send new-inquiry e-mails to
        </label>
        <textarea
          id={`${ids}-emails`}
          rows={2}
          className="field-input"
          value={emails}
          aria-invalid={emailMessage ? true : undefined}
          aria-describedby={emailMessage ? `${ids}-emails-error` : `${ids}-emails-hint`}
          onChange={(event) => setEmails(event.target.value)}
        />
        {emailMessage ? (
          <p id={`${ids}-emails-error`} className="field-error">
            {emailMessage}
          </p>
        ) : (
          <p id={`${ids}-emails-hint`} className="mt-1 text-xs text-slate">
            A shared inbox, say. Separate addresses with commas. The first one is also where homeowners’ replies go if the profile has no reply address.
          </p>
        )}
      </div>

      <div>
        <label htmlFor={`${ids}-target`} className="field-label">
          Answer each new inquiry within <span className="font-normal text-slate">(working minutes)</span>
        </label>
        <input
          id={`${ids}-target`}
          type="number"
          inputMode="numeric"
          className="field-input figures max-w-32"
          value={target}
          aria-invalid={fields.responseTargetMinutes ? true : undefined}
          aria-describedby={fields.responseTargetMinutes ? `${ids}-target-error` : `${ids}-target-hint`}
          onChange={(event) => setTarget(event.target.value)}
        />
        {fields.responseTargetMinutes ? (
          <p id={`${ids}-target-error`} className="field-error">
            {fields.responseTargetMinutes}
          </p>
        ) : (
          <p id={`${ids}-target-hint`} className="mt-1 text-xs text-slate">
            {workingTimeText(minutes)}
            {workingTimeText(minutes) && ' — '}counted Monday to Friday, 08:00–17:00 on your clock. Later than that an inquiry shows as overdue.
          </p>
        )}
      </div>

      <div className="flex items-center gap-3">
        <button type="submit" className="button-primary" disabled={saving}>
          {saving ? 'Saving…' : 'Save notifications'}
        </button>
        <StatusLine status={status} />
      </div>
    </form>
  );
}
