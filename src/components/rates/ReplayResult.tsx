import { lazy, Suspense } from 'react';
import type { ReplaySummary } from './draft-api';

const ReplayChart = lazy(() => import('./ReplayChart'));

type Props = { summary: ReplaySummary; money: (cents: number) => string };

const signed = (value: number, text: string) => (value > 0 ? `+${text}` : value < 0 ? `−${text}` : text);

/** A finished replay: the counts, the total and median change, the minimum job, the bands as a chart and a table, and the largest moves. */
export function ReplayResult({ summary, money }: Props) {
  const cents = (value: number) => signed(value, money(Math.abs(value)));
  const percent = (value: number) => signed(value, `${Math.abs(value).toFixed(1)} %`);
  if (summary.inquiries === 0) return <p className="mt-3">No inquiries came in during the last 90 days, so there is nothing to replay.</p>;
  return (
    <div className="mt-3 space-y-4">
      <dl className="figures grid max-w-2xl grid-cols-2 gap-x-6 gap-y-1 text-sm sm:grid-cols-3" aria-label="Replay summary">
        <div>
          <dt className="text-slate">Inquiries priced</dt>
          <dd className="font-medium">
            {summary.compared} of {summary.inquiries}
          </dd>
        </div>
        <div>
          <dt className="text-slate">Would go up</dt>
          <dd className="font-medium">{summary.up}</dd>
        </div>
        <div>
          <dt className="text-slate">Would go down</dt>
          <dd className="font-medium">{summary.down}</dd>
        </div>
        <div>
          <dt className="text-slate">Unchanged</dt>
          <dd className="font-medium">{summary.same}</dd>
        </div>
        <div>
          <dt className="text-slate">Total change</dt>
          <dd className="font-medium">{cents(summary.totalChangeCents)}</dd>
        </div>
        <div>
          <dt className="text-slate">Median change</dt>
          <dd className="font-medium">
            {cents(summary.medianChangeCents)} ({percent(summary.medianChangePercent)})
          </dd>
        </div>
        <div>
          <dt className="text-slate">Newly held up by the minimum job</dt>
          <dd className="font-medium">{summary.intoMinimum.length > 0 ? summary.intoMinimum.join(', ') : 'none'}</dd>
        </div>
        <div>
          <dt className="text-slate">No longer held up by it</dt>
          <dd className="font-medium">{summary.outOfMinimum.length > 0 ? summary.outOfMinimum.join(', ') : 'none'}</dd>
        </div>
      </dl>

      <div className="grid gap-4 lg:grid-cols-2">
        <figure aria-label="Chart of how many inquiries would move by how much">
          <Suspense fallback={<p>Drawing the chart…</p>}>
            <ReplayChart bands={summary.bands} />
          </Suspense>
        </figure>
        <table className="figures text-sm" aria-label="Inquiries by change in the middle of the range">
          <thead>
            <tr className="text-left text-slate">
              <th className="pr-4 font-medium">Change</th>
              <th className="font-medium">Inquiries</th>
            </tr>
          </thead>
          <tbody>
            {summary.bands.map((band) => (
              <tr key={band.label} className="border-t border-slate/20">
                <th scope="row" className="py-1 pr-4 text-left font-normal">
                  {band.label}
                </th>
                <td className="py-1">{band.count}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>

      {summary.largest.length > 0 && (
        <div className="overflow-x-auto">
          <table className="figures text-sm" aria-label="Largest changes">
            <caption className="text-left font-bold">Largest changes</caption>
            <thead>
              <tr className="text-left text-slate">
                <th className="pr-4 font-medium">Inquiry</th>
                <th className="pr-4 font-medium">Published</th>
                <th className="pr-4 font-medium">Draft</th>
                <th className="font-medium">Change</th>
              </tr>
            </thead>
            <tbody>
              {summary.largest.map((row) => (
                <tr key={row.leadId} className="border-t border-slate/20">
                  <th scope="row" className="py-1 pr-4 text-left font-normal">
                    <a href={`/app/leads/${row.leadId}`}>{row.reference}</a>
                  </th>
                  <td className="py-1 pr-4">{money(row.publishedMiddleCents)}</td>
                  <td className="py-1 pr-4">{money(row.draftMiddleCents)}</td>
                  <td className="py-1">
                    {cents(row.changeCents)} ({percent(row.changePercent)})
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}

      {summary.refused.length > 0 && (
        <div>
          <h4 className="font-bold">Could not be priced</h4>
          <ul className="list-disc pl-5 text-sm">
            {summary.refused.map((r) => (
              <li key={r.reference}>
                {r.reference}: {r.reason}
              </li>
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}
