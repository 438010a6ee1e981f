import { fieldAt } from '~/lib/shared/rate-book-fields';
import { formatInZone } from '~/lib/shared/time';
import type { DraftConflict } from './draft-api';
import { storedText } from './stored-text';

type Props = {
  conflict: DraftConflict;
  timeZone: string;
  currency: string;
  locale: string;
  onLoadTheirs: () => void;
  onKeepMine: () => void;
};

/**
 * Another owner saved this draft after it was loaded here. Nothing was overwritten: the owner sees
 * who saved when and what they changed, then takes their version or keeps editing their own (the
 * next save then replaces theirs, knowingly).
 */
export function ConflictNotice({ conflict, timeZone, currency, locale, onLoadTheirs, onKeepMine }: Props) {
  const { draft, changed } = conflict;
  const labels = changed.map((c) => c.label || fieldAt(c.path)?.label || c.path);
  return (
    <div role="alert" className="rounded-md border border-brick/60 bg-white p-4">
      <p className="font-medium">
        Someone else saved this draft at <time dateTime={draft.updatedAt}>{formatInZone(draft.updatedAt, timeZone, 'dateTime')}</time> — changed:{' '}
        {labels.length > 0 ? labels.join(', ') : 'nothing you changed'}.
      </p>
      <p className="mt-1 text-sm text-slate">
        {draft.updatedBy ? `Saved by ${draft.updatedBy}. ` : ''}Your changes have not been saved, and theirs have not been overwritten.
      </p>
      {changed.length > 0 && (
        <table className="figures mt-3 text-sm">
          <thead>
            <tr className="text-left text-slate">
              <th className="pr-4 font-medium">Field</th>
              <th className="pr-4 font-medium">Theirs</th>
              <th className="font-medium">Yours</th>
            </tr>
          </thead>
          <tbody>
            {changed.map((c, i) => (
              <tr key={c.path}>
                <td className="pr-4">{labels[i]}</td>
                <td className="pr-4">{storedText(c.path, c.theirs, currency, locale)}</td>
                <td>{storedText(c.path, c.mine, currency, locale)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <div className="mt-3 flex flex-wrap gap-2">
        <button type="button" className="button-primary" onClick={onLoadTheirs}>
          Load their version
        </button>
        <button type="button" className="button-quiet" onClick={onKeepMine}>
          Keep editing mine
        </button>
      </div>
    </div>
  );
}
