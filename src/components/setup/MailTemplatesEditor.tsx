/**
 * The owner's screen for the firm's e-mail templates: change, add and remove them. What each
 * placeholder becomes is listed beside them (PLACEHOLDERS), so the syntax is documented where it is used.
 */
import { useId, useState } from 'react';
import '~/lib/shared/zod-in-browser';
import { BODY_MAX, mailTemplateSchema, SUBJECT_MAX, type MailTemplateView } from '~/lib/shared/inquiry-work-schemas';
import { sendJson, asRequestFailed, type FormStatus } from '../inquiries/page/api';
import { StatusLine } from '../inquiries/page/StatusLine';

type Draft = { name: string; subject: string; body: string };
const EMPTY: Draft = { name: '', subject: '', body: '' };

function fieldErrors(error: unknown): { message: string; fields: Record<string, string> } {
  const problem = asRequestFailed(error);
  return { message: problem.message, fields: problem.fields };
}

function TemplateForm({
  initial,
  submitLabel,
  onSubmit,
  onRemove,
}: {
  initial: Draft;
  submitLabel: string;
  onSubmit: (draft: Draft) => Promise<void>;
  onRemove?: () => Promise<void>;
}) {
  const id = useId();
  const [draft, setDraft] = useState(initial);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<FormStatus>(null);
  const [busy, setBusy] = useState(false);

  async function run(action: () => Promise<void>, done: string) {
    setBusy(true);
    setStatus(null);
    try {
      await action();
      setErrors({});
      setStatus({ kind: 'done', text: done });
    } catch (error) {
      const { message, fields } = fieldErrors(error);
      setErrors(fields);
      setStatus({ kind: 'failed', text: message });
    } finally {
      setBusy(false);
    }
  }

  async function submit(event: React.SyntheticEvent<HTMLFormElement>) {
    event.preventDefault();
    const parsed = mailTemplateSchema.safeParse(draft);
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
      setStatus({ kind: 'failed', text: 'Some fields need attention.' });
      return;
    }
    await run(() => onSubmit(parsed.data), 'Saved.');
  }

  const input = (name: keyof Draft, label: string, max: number, rows?: number) => {
    const common = {
      id: `${id}-${name}`,
      className: rows ? 'field-input font-mono text-sm' : 'field-input',
      maxLength: max,
      value: draft[name],
      'aria-invalid': errors[name] ? true : undefined,
      'aria-describedby': errors[name] ? `${id}-${name}-error` : undefined,
      onChange: (e: React.ChangeEvent<HTMLInputElement | HTMLTextAreaElement>) => setDraft({ ...draft, [name]: e.target.value }),
    };
    return (
      <div>
        <label htmlFor={`${id}-${name}`} className="field-label">
          {label}
        </label>
        {rows ? <textarea rows={rows} {...common} /> : <input {...common} />}
        {errors[name] && (
          <p id={`${id}-${name}-error`} className="field-error">
            {errors[name]}
          </p>
        )}
      </div>
    );
  };

  return (
    <form onSubmit={submit} noValidate className="space-y-3" aria-label={initial.name ? `Template ${initial.name}` : 'New template'}>
      {input('name', 'Name (staff see it in the picker)', 80)}
      {input('subject', 'Subject', SUBJECT_MAX)}
      {input('body', 'Message', BODY_MAX, 9)}
      <div className="flex flex-wrap items-center gap-3">
        <button type="submit" className="button-primary" disabled={busy}>
          {submitLabel}
        </button>
        {onRemove && (
          <button type="button" className="button-quiet" disabled={busy} onClick={() => run(onRemove, 'Removed.')}>
            Remove
          </button>
        )}
        <StatusLine status={status} />
      </div>
    </form>
  );
}

export function MailTemplatesEditor({ initial }: { initial: MailTemplateView[] }) {
  const [templates, setTemplates] = useState(initial);
  // A new key after each addition gives the "add" form fresh, empty fields.
  const [addKey, setAddKey] = useState(0);

  return (
    <div className="space-y-4">
      {templates.length === 0 && <p className="text-sm text-slate">No templates yet. Add one below.</p>}
      {templates.map((t) => (
        <article key={t.id} className="rounded border border-slate/20 bg-white p-4">
          <h2 className="mb-2 font-bold">{t.name}</h2>
          <TemplateForm
            initial={t}
            submitLabel="Save changes"
            onSubmit={async (draft) => {
              const saved = await sendJson<MailTemplateView>('PATCH', `/api/app/mail-templates/${t.id}`, draft);
              setTemplates((all) => all.map((x) => (x.id === t.id ? saved : x)));
            }}
            onRemove={async () => {
              await sendJson('DELETE', `/api/app/mail-templates/${t.id}`);
              setTemplates((all) => all.filter((x) => x.id !== t.id));
            }}
          />
        </article>
      ))}
      <article className="rounded border border-dashed border-slate/40 bg-white p-4">
        <h2 className="mb-2 font-bold">Add a template</h2>
        <TemplateForm
          key={addKey}
          initial={EMPTY}
          submitLabel="Add template"
          onSubmit={async (draft) => {
            const saved = await sendJson<MailTemplateView>('POST', '/api/app/mail-templates', draft);
            setTemplates((all) => [...all, saved]);
            setAddKey((k) => k + 1);
          }}
        />
      </article>
    </div>
  );
}
