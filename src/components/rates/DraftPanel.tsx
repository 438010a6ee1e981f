import { useState } from 'react';
import { asRequestFailed } from '~/components/inquiries/page/api';
import { formatInZone } from '~/lib/shared/time';
import { discardDraft, publishDraft, startDraft, type RatesOverview } from './draft-api';
import type { MoneyFormat } from './RateBookHome';
import { useHydrated } from '../use-hydrated';

type Props = { overview: RatesOverview; format: MoneyFormat; onChanged: () => Promise<void> };
type Asking = 'publish' | 'discard' | null;

/**
 * The version pricing estimates now, and the draft beside it. Publishing and discarding each ask
 * once more, saying what will happen, because neither can be undone (an older version can be
 * copied into a new draft, though).
 */
export function DraftPanel({ overview, format, onChanged }: Props) {
  const { published, draft } = overview;
  const [asking, setAsking] = useState<Asking>(null);
  const [note, setNote] = useState('');
  const hydrated = useHydrated();
  const [working, setBusy] = useState(false);
  const busy = working || !hydrated;
  const [failure, setFailure] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const when = (iso: string) => formatInZone(iso, format.timeZone, 'dateTime');

  const run = async (work: () => Promise<string>) => {
    setBusy(true);
    setFailure(null);
    setDone(null);
    try {
      const message = await work();
      setAsking(null);
      setNote('');
      await onChanged();
      setDone(message);
    } catch (error) {
      setFailure(asRequestFailed(error).message);
    } finally {
      setBusy(false);
    }
  };
  const publish = () =>
    run(async () => {
      const version = await publishDraft(draft!.revision, note.trim() || undefined);
      return `Version ${version.number} is published. Every new estimate uses it from now on; inquiries already received keep their prices.`;
    });
  const discard = () =>
    run(async () => {
      await discardDraft(draft!.revision);
      return `The draft was discarded. Estimates still use version ${published?.number ?? '—'}.`;
    });
  const start = () =>
    run(async () => {
      const started = await startDraft();
      return `Draft version ${started.number} started${started.basedOn !== null ? ` as a copy of version ${started.basedOn}` : ''}.`;
    });

  return (
    <section aria-labelledby="rates-now" className="grid gap-4 md:grid-cols-2">
      <div className="rounded-md border border-slate/30 bg-white p-4">
        <h2 id="rates-now" className="font-bold">
          Pricing estimates now
        </h2>
        {published ? (
          <p className="mt-1">
            Version {published.number}
            {published.note ? ` — ${published.note}` : ''}
            <br />
            <span className="text-sm text-slate">
              Published {published.publishedAt ? when(published.publishedAt) : ''}
              {published.publishedBy ? ` by ${published.publishedBy}` : ''}.
            </span>
          </p>
        ) : (
          <p className="mt-1">No version is published yet, so the widget cannot price. Start a draft, make its numbers yours, and publish it.</p>
        )}
      </div>

      <div className="rounded-md border border-slate/30 bg-white p-4">
        <h2 className="font-bold">Draft</h2>
        {draft ? (
          <>
            <p className="mt-1">
              Version {draft.number}
              {draft.basedOn !== null ? `, started from version ${draft.basedOn}` : ''}
              <br />
              <span className="text-sm text-slate">
                Last saved {when(draft.updatedAt)}
                {draft.updatedBy ? ` by ${draft.updatedBy}` : ''}. Estimates do not use it until it is published.
              </span>
            </p>
            <div className="mt-3 flex flex-wrap gap-2">
              <a className="button-primary" href="/app/rates/edit">
                Edit the draft
              </a>
              <button type="button" className="button-quiet" onClick={() => setAsking('publish')} disabled={busy} aria-expanded={asking === 'publish'}>
                Publish…
              </button>
              <button type="button" className="button-quiet" onClick={() => setAsking('discard')} disabled={busy} aria-expanded={asking === 'discard'}>
                Discard…
              </button>
            </div>
          </>
        ) : (
          <>
            <p className="mt-1">
              No draft.{' '}
              {published
                ? `A new draft starts as a copy of version ${published.number}; estimates keep using that until you publish.`
                : 'A new draft starts from example numbers for you to make your own.'}
            </p>
            <button type="button" className="button-primary mt-3" onClick={start} disabled={busy}>
              Start a draft
            </button>
          </>
        )}

        {asking === 'publish' && draft && (
          <div className="mt-4 space-y-2 rounded-md border border-slate/30 p-3">
            <p>
              From the moment you publish, every new estimate, in the widget and in the office, uses version {draft.number}. Inquiries already received keep the
              prices they were given.
            </p>
            <label className="block text-sm" htmlFor="publish-note">
              What changed (optional, shown in the version list)
            </label>
            <input id="publish-note" className="field-input max-w-md" maxLength={200} value={note} onChange={(e) => setNote(e.target.value)} />
            <div className="flex gap-2">
              <button type="button" className="button-primary" onClick={publish} disabled={busy}>
                {busy ? 'Publishing…' : `Publish version ${draft.number}`}
              </button>
              <button type="button" className="button-quiet" onClick={() => setAsking(null)} disabled={busy}>
                Cancel
              </button>
            </div>
          </div>
        )}
        {asking === 'discard' && draft && (
          <div className="mt-4 space-y-2 rounded-md border border-slate/30 p-3">
            <p>Throw away draft version {draft.number} and every change saved in it? This cannot be undone.</p>
            <div className="flex gap-2">
              <button type="button" className="button-primary bg-brick hover:bg-brick" onClick={discard} disabled={busy}>
                {busy ? 'Discarding…' : 'Discard the draft'}
              </button>
              <button type="button" className="button-quiet" onClick={() => setAsking(null)} disabled={busy}>
                Keep it
              </button>
            </div>
          </div>
        )}
        {failure && (
          <p role="alert" className="mt-3 text-brick">
            {failure}
          </p>
        )}
        {done && (
          <p role="status" className="mt-3 font-medium text-lapwing">
            {done}
          </p>
        )}
      </div>
    </section>
  );
}
