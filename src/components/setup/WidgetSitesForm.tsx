import '~/lib/shared/zod-in-browser';
import { useEffect, useId, useState } from 'react';
import { fieldsFromZod } from '~/lib/estimate/errors.ts';
import { MAX_EMBED_ORIGINS, widgetSitesSchema, type WidgetSites } from '~/lib/shared/setup-schemas';
import { asRequestFailed, sendJson, type FormStatus } from '~/components/inquiries/page/api';
import { StatusLine } from '~/components/inquiries/page/StatusLine';

type Props = { initial: WidgetSites };

/**
 * The sites allowed to embed the price widget (Setup → Widget). Each entry is checked by the shared
 * schema before sending and again by the route; a message names the entry it is about.
 */
export function WidgetSitesForm({ initial }: Props) {
  const ids = useId();
  const [sites, setSites] = useState<string[]>(initial.embedOrigins.length ? initial.embedOrigins : ['']);
  const [fields, setFields] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<FormStatus>(null);
  const [saving, setSaving] = useState(false);
  const [ready, setReady] = useState(false);
  useEffect(() => setReady(true), []);

  const change = (index: number, value: string) => setSites((list) => list.map((site, i) => (i === index ? value : site)));
  const remove = (index: number) => setSites((list) => (list.length === 1 ? [''] : list.filter((_, i) => i !== index)));

  async function save(event: { preventDefault(): void }) {
    event.preventDefault();
    setStatus(null);
    // Blank rows are left out rather than refused: they are the empty row the form offers.
    const body = { embedOrigins: sites.filter((site) => site.trim() !== '') };
    const checked = widgetSitesSchema.safeParse(body);
    if (!checked.success) {
      setFields(fieldsFromZod(checked.error));
      setStatus({ kind: 'failed', text: 'Some sites need attention.' });
      return;
    }
    setSaving(true);
    try {
      const saved = await sendJson<WidgetSites>('PUT', '/api/app/settings/widget', body);
      setSites(saved.embedOrigins.length ? saved.embedOrigins : ['']);
      setFields({});
      setStatus({ kind: 'done', text: 'Saved. These sites may show the widget from now on.' });
    } catch (error) {
      const failed = asRequestFailed(error);
      setFields(failed.fields);
      setStatus({ kind: 'failed', text: failed.message });
    } finally {
      setSaving(false);
    }
  }

  // Field paths are those of the list sent, which leaves blank rows out.
  const sentIndex = (index: number) => sites.slice(0, index).filter((site) => site.trim() !== '').length;

  return (
    <form onSubmit={save} noValidate className="mt-3 max-w-xl space-y-3" data-ready={ready ? 'true' : undefined}>
      <ul className="space-y-2">
        {sites.map((site, index) => {
          const id = `${ids}-site-${index}`;
          const error = site.trim() !== '' ? fields[`embedOrigins.${sentIndex(index)}`] : undefined;
          return (
            <li key={index}>
              <div className="flex items-center gap-2">
                <label htmlFor={id} className="sr-only">
                  Allowed site {index + 1}
                </label>
                <input
                  id={id}
                  className="field-input"
                  type="url"
                  inputMode="url"
                  autoComplete="off"
                  spellCheck={false}
                  placeholder="https://www.example.com"
                  value={site}
                  aria-invalid={error ? true : undefined}
                  aria-describedby={error ? `${id}-error` : undefined}
                  onChange={(event) => change(index, event.target.value)}
                />
                <button type="button" className="button-quiet px-2 py-1 text-sm" onClick={() => remove(index)}>
                  Remove<span className="sr-only"> site {index + 1}</span>
                </button>
              </div>
              {error && (
                <p id={`${id}-error`} className="field-error">
                  {error}
                </p>
              )}
            </li>
          );
        })}
      </ul>
      {fields.embedOrigins && <p className="field-error">{fields.embedOrigins}</p>}
      <button
        type="button"
        className="button-quiet px-2 py-1 text-sm"
        disabled={sites.length >= MAX_EMBED_ORIGINS}
        onClick={() => setSites((list) => [...list, ''])}
      >
        Add a site
      </button>
      <div className="flex items-center gap-3">
        <button type="submit" className="button-primary" disabled={saving}>
          {saving ? 'Saving…' : 'Save allowed sites'}
        </button>
        <StatusLine status={status} />
      </div>
    </form>
  );
}
