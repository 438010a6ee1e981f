import '~/lib/shared/zod-in-browser';
import { useState } from 'react';
import { asRequestFailed } from '~/components/inquiries/page/api';
import { startDraft, type RateDraft, type RatesOverview } from './draft-api';
import { DraftForm } from './DraftForm';

type Props = {
  /** The firm's versions and draft as the page found them. */
  initial: RatesOverview;
  /** The firm's clock, for when a draft was saved. */
  timeZone: string;
};

/** Editing the firm's Rate book draft (`/app/rates/edit`); without a draft, starting one from the published version. */
export function RateBookEditor({ initial, timeZone }: Props) {
  const [overview, setOverview] = useState<RatesOverview>(initial);
  const [failure, setFailure] = useState<string | null>(null);
  const [starting, setStarting] = useState(false);

  const start = async () => {
    setStarting(true);
    setFailure(null);
    try {
      const draft: RateDraft = await startDraft();
      setOverview((o) => ({ ...o, draft }));
    } catch (error) {
      setFailure(asRequestFailed(error).message);
    } finally {
      setStarting(false);
    }
  };

  if (!overview.draft)
    return (
      <div className="mt-4 max-w-prose space-y-3">
        <p>
          There is no draft yet.{' '}
          {overview.published
            ? `A draft starts as a copy of version ${overview.published.number}, the one pricing estimates now; estimates keep using that until you publish the draft.`
            : 'With no published version yet, a draft starts from example numbers for you to make your own.'}
        </p>
        <button type="button" className="button-primary" onClick={start} disabled={starting}>
          {starting ? 'Starting…' : 'Start a draft'}
        </button>
        {failure && (
          <p role="alert" className="text-brick">
            {failure}
          </p>
        )}
      </div>
    );
  const { draft } = overview;
  return (
    <>
      <p className="mt-1 text-sm text-slate">
        Draft version {draft.number}
        {draft.basedOn !== null ? `, started from version ${draft.basedOn}` : ''}. Estimates keep using the published version until you publish it.
      </p>
      <DraftForm key={draft.id} draft={draft} timeZone={timeZone} />
    </>
  );
}
