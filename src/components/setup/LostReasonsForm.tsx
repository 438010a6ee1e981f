import '~/lib/shared/zod-in-browser';
import { useId, useState } from 'react';
import { fieldsFromZod } from '~/lib/estimate/errors.ts';
import { lostReasonsSchema, MAX_LOST_REASONS } from '~/lib/shared/lead-flow-schemas';
import { RequestFailed, sendJson } from '~/components/inquiries/page/api';

type Props = { initial: string[] };

/** The owner's list of reasons an inquiry is not going ahead: edit, add, remove, reorder, save. */
export function LostReasonsForm({ initial }: Props) {
  const ids = useId();
  const [reasons, setReasons] = useState(initial);
  const [fields, setFields] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const change = (index: number, value: string) => setReasons((list) => list.map((r, i) => (i === index ? value : r)));
  const remove = (index: number) => setReasons((list) => list.filter((_, i) => i !== index));
  const moveUp = (index: number) =>
    setReasons((list) => (index === 0 ? list : [...list.slice(0, index - 1), list[index]!, list[index - 1]!, ...list.slice(index + 1)]));

  async function save(event: { preventDefault(): void }) {
    event.preventDefault();
    setStatus(null);
    const parsed = lostReasonsSchema.safeParse({ reasons });
    if (!parsed.success) return setFields(fieldsFromZod(parsed.error));
    setFields({});
    setBusy(true);
    try {
      const saved = await sendJson<{ reasons: string[] }>('PUT', '/api/app/settings/lost-reasons', parsed.data);
      setReasons(saved.reasons);
      setStatus('Saved. The stage control offers these reasons from now on.');
    } catch (error) {
      if (!(error instanceof RequestFailed)) throw error;
      setFields(Object.keys(error.fields).length ? error.fields : { form: error.message });
    } finally {
      setBusy(false);
    }
  }

  return (
    <form onSubmit={save} noValidate className="mt-4 max-w-lg space-y-3">
      <ol className="space-y-2">
        {reasons.map((reason, index) => (
          <li key={index} className="flex items-start gap-2">
            <div className="flex-1">
              <label htmlFor={`${ids}-${index}`} className="sr-only">
                Reason {index + 1}
              </label>
              <input
                id={`${ids}-${index}`}
                className="field-input mt-0"
                value={reason}
                maxLength={120}
                onChange={(e) => change(index, e.target.value)}
                aria-invalid={fields[`reasons.${index}`] ? true : undefined}
                aria-describedby={fields[`reasons.${index}`] ? `${ids}-${index}-error` : undefined}
              />
              {fields[`reasons.${index}`] && (
                <p id={`${ids}-${index}-error`} className="field-error">
                  {fields[`reasons.${index}`]}
                </p>
              )}
            </div>
            <button
              type="button"
              className="button-quiet px-2 py-2 text-sm"
              onClick={() => moveUp(index)}
              disabled={index === 0}
              aria-label={`Move “${reason}” up`}
            >
              ↑
            </button>
            <button type="button" className="button-quiet px-2 py-2 text-sm" onClick={() => remove(index)} aria-label={`Remove “${reason}”`}>
              Remove
            </button>
          </li>
        ))}
      </ol>
      {fields.reasons && <p className="field-error">{fields.reasons}</p>}
      <div className="flex gap-2">
        <button type="button" className="button-quiet" onClick={() => setReasons((list) => [...list, ''])} disabled={reasons.length >= MAX_LOST_REASONS}>
          Add a reason
        </button>
        <button type="submit" className="button-primary" disabled={busy}>
          {busy ? 'Saving…' : 'Save reasons'}
        </button>
      </div>
      {fields.form && (
        <p role="alert" className="field-error">
          {fields.form}
        </p>
      )}
      {status && (
        <p role="status" className="rounded-md bg-sawdust/60 px-3 py-2 text-sm">
          {status}
        </p>
      )}
    </form>
  );
}
