import { useState } from 'react';
import { asRequestFailed } from '~/components/inquiries/page/api';
import { formatInZone } from '~/lib/shared/time';
import { compareVersions, startDraftFrom, type RatesOverview, type RateVersionSummary, type VersionComparison } from './draft-api';
import { whereIs } from './error-summary';
import type { MoneyFormat } from './RateBookHome';
import { storedText } from './stored-text';
import { useHydrated } from '../use-hydrated';

type Props = { overview: RatesOverview; format: MoneyFormat; onChanged: () => Promise<void> };

const STATUS = { published: 'Pricing estimates', draft: 'Draft', retired: 'Earlier' } as const;

/** A value in the comparison: a row that is only on one side is "not there" on the other. */
function cell(path: string, value: unknown, format: MoneyFormat): string {
  if (value === undefined) return 'not there';
  if (value !== null && typeof value === 'object' && !Array.isArray(value)) return 'a row';
  return storedText(path, value, format.currency, format.locale);
}

/**
 * Every version, newest first, with who published it and when; any two compared field by field;
 * an older version copied into a new draft when the owner wants its numbers back.
 */
export function VersionList({ overview, format, onChanged }: Props) {
  const { versions, published, draft } = overview;
  const [before, setBefore] = useState(published?.id ?? versions[1]?.id ?? '');
  const [after, setAfter] = useState(draft?.id ?? versions[0]?.id ?? '');
  const [comparison, setComparison] = useState<VersionComparison | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const hydrated = useHydrated();
  const [working, setBusy] = useState(false);
  const busy = working || !hydrated;
  const when = (iso: string | null) => (iso ? formatInZone(iso, format.timeZone, 'dateTime') : '');
  const name = (v: RateVersionSummary) => `Version ${v.number}${v.note ? ` — ${v.note}` : ''}`;

  const compare = async () => {
    setBusy(true);
    setFailure(null);
    try {
      setComparison(await compareVersions(before, after));
    } catch (error) {
      setFailure(asRequestFailed(error).message);
    } finally {
      setBusy(false);
    }
  };
  const copy = async (version: RateVersionSummary) => {
    setBusy(true);
    setFailure(null);
    try {
      await startDraftFrom(version.id);
      await onChanged();
    } catch (error) {
      setFailure(asRequestFailed(error).message);
    } finally {
      setBusy(false);
    }
  };

  return (
    <section aria-labelledby="versions" className="space-y-4">
      <h2 id="versions" className="text-lg font-bold">
        Versions
      </h2>
      <div className="overflow-x-auto">
        <table className="figures w-full text-sm">
          <thead>
            <tr className="text-left text-slate">
              <th className="py-1 pr-4 font-medium">Version</th>
              <th className="py-1 pr-4 font-medium">State</th>
              <th className="py-1 pr-4 font-medium">Published</th>
              <th className="py-1 font-medium">
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {versions.map((v) => (
              <tr key={v.id} className="border-t border-slate/20">
                <th scope="row" className="py-1 pr-4 text-left font-medium">
                  {name(v)}
                </th>
                <td className="py-1 pr-4">{STATUS[v.status]}</td>
                <td className="py-1 pr-4">
                  {v.publishedAt ? `${when(v.publishedAt)}${v.publishedBy ? ` by ${v.publishedBy}` : ''}` : v.status === 'draft' ? 'not yet' : ''}
                </td>
                <td className="py-1">
                  {!draft && v.status !== 'draft' && (
                    <button type="button" className="text-lapwing underline" onClick={() => copy(v)} disabled={busy}>
                      Start a draft from it<span className="sr-only"> (version {v.number})</span>
                    </button>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>

      {versions.length > 1 && (
        <div className="space-y-3">
          <h3 className="font-bold">Compare two versions</h3>
          <div className="flex flex-wrap items-end gap-3">
            <div>
              <label className="field-label" htmlFor="compare-before">
                From
              </label>
              <select id="compare-before" className="field-input" value={before} onChange={(e) => setBefore(e.target.value)}>
                {versions.map((v) => (
                  <option key={v.id} value={v.id}>
                    {name(v)}
                  </option>
                ))}
              </select>
            </div>
            <div>
              <label className="field-label" htmlFor="compare-after">
                To
              </label>
              <select id="compare-after" className="field-input" value={after} onChange={(e) => setAfter(e.target.value)}>
                {versions.map((v) => (
                  <option key={v.id} value={v.id}>
                    {name(v)}
                  </option>
                ))}
              </select>
            </div>
            <button type="button" className="button-quiet" onClick={compare} disabled={busy || !before || !after}>
              Compare
            </button>
          </div>
          {comparison &&
            (comparison.changes.length === 0 ? (
              <p role="status">
                Versions {comparison.before.number} and {comparison.after.number} have the same numbers.
              </p>
            ) : (
              <div className="overflow-x-auto">
                <table className="figures text-sm" aria-label={`Changes from version ${comparison.before.number} to version ${comparison.after.number}`}>
                  <thead>
                    <tr className="text-left text-slate">
                      <th className="py-1 pr-4 font-medium">Field</th>
                      <th className="py-1 pr-4 font-medium">Version {comparison.before.number}</th>
                      <th className="py-1 font-medium">Version {comparison.after.number}</th>
                    </tr>
                  </thead>
                  <tbody>
                    {comparison.changes.map((c) => (
                      <tr key={c.path} className="border-t border-slate/20">
                        <th scope="row" className="py-1 pr-4 text-left font-normal">
                          {whereIs(c.path)}
                        </th>
                        <td className="py-1 pr-4">{cell(c.path, c.before, format)}</td>
                        <td className="py-1">{cell(c.path, c.after, format)}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            ))}
        </div>
      )}
      {failure && (
        <p role="alert" className="text-brick">
          {failure}
        </p>
      )}
    </section>
  );
}
