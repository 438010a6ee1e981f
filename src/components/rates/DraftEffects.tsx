import { lazy, Suspense, useState } from 'react';
import useSWR from 'swr';
import { asRequestFailed, getJson } from '~/components/inquiries/page/api';
import { formatMoney } from '~/lib/estimate';
import { PREVIEW_URL, REPLAY_URL, startReplay, type PricedSide, type Replay, type SamplePreview } from './draft-api';
import type { MoneyFormat } from './RateBookHome';
import { ReplayResult } from './ReplayResult';
import { useHydrated } from '../use-hydrated';

// The charting package is large: loaded only once there is something to draw.
const SampleChart = lazy(() => import('./SampleChart'));

type Props = { hasPublished: boolean; format: MoneyFormat };

const RUNNING = new Set<Replay['status']>(['queued', 'running']);

/**
 * What the saved draft would do, before it is published: each finish's sample room priced by both
 * versions, and on request a replay of the last 90 days of inquiries. Keyed by the draft's revision
 * by its parent, so a newer save starts over.
 */
export function DraftEffects({ hasPublished, format }: Props) {
  // Job prices in whole units, as the widget shows them; a range's ends are rounded anyway.
  const money = (cents: number) => formatMoney(Math.round(cents / 100) * 100, format.currency, format.locale, { wholeUnits: true });
  const preview = useSWR<SamplePreview>(PREVIEW_URL, getJson, { revalidateOnFocus: true });
  const [replayId, setReplayId] = useState<string | null>(null);
  const hydrated = useHydrated();
  const [starting, setStarting] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);
  const replay = useSWR<Replay>(replayId ? `${REPLAY_URL}/${replayId}` : null, getJson, {
    refreshInterval: (latest) => (latest && !RUNNING.has(latest.status) ? 0 : 1000),
  });

  const begin = async () => {
    setStarting(true);
    setFailure(null);
    try {
      const started = await startReplay();
      await replay.mutate(started, { revalidate: false });
      setReplayId(started.id);
    } catch (error) {
      setFailure(asRequestFailed(error).message);
    } finally {
      setStarting(false);
    }
  };

  const side = (priced: PricedSide | null) =>
    priced === null
      ? '—'
      : priced.ok
        ? `${money(priced.lowCents)} – ${money(priced.highCents)}${priced.minimumApplied ? ' (minimum job)' : ''}`
        : priced.reason;
  const rooms = preview.data?.rooms ?? [];
  const bars = rooms.map((r) => ({
    finish: r.treatmentName,
    published: r.published?.ok ? r.published.middleCents / 100 : null,
    draft: r.draft.ok ? r.draft.middleCents / 100 : null,
  }));
  const current = replay.data;

  return (
    <section aria-labelledby="draft-effects" className="space-y-6">
      <h2 id="draft-effects" className="text-lg font-bold">
        What the draft would do
      </h2>
      <p className="max-w-prose text-sm text-slate">As the draft was last saved. Nothing here changes a price anyone has been given.</p>

      <div>
        <h3 className="font-bold">Sample rooms</h3>
        {preview.error && (
          <p role="alert" className="text-brick">
            {asRequestFailed(preview.error).message}
          </p>
        )}
        {!preview.data && !preview.error && <p role="status">Pricing the sample rooms…</p>}
        {preview.data && (
          <>
            <div className="mt-2 overflow-x-auto">
              <table className="figures w-full text-sm" aria-label="Sample rooms, published and draft">
                <thead>
                  <tr className="text-left text-slate">
                    <th className="py-1 pr-4 font-medium">Finish</th>
                    <th className="py-1 pr-4 font-medium">Room</th>
                    {hasPublished && <th className="py-1 pr-4 font-medium">Published (version {preview.data.published?.number})</th>}
                    <th className="py-1 pr-4 font-medium">Draft (version {preview.data.draft.number})</th>
                    {hasPublished && <th className="py-1 font-medium">Change in the middle</th>}
                  </tr>
                </thead>
                <tbody>
                  {rooms.map((room) => (
                    <tr key={room.treatmentId} className="border-t border-slate/20">
                      <th scope="row" className="py-1 pr-4 text-left font-medium">
                        {room.treatmentName}
                      </th>
                      <td className="py-1 pr-4">{room.description}</td>
                      {hasPublished && <td className="py-1 pr-4">{side(room.published)}</td>}
                      <td className="py-1 pr-4">{side(room.draft)}</td>
                      {hasPublished && <td className="py-1">{changeText(room.published, room.draft, money)}</td>}
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
            {bars.length > 0 && (
              <figure className="mt-3" aria-label="Chart of the sample rooms' middle prices, published and draft">
                <Suspense fallback={<p>Drawing the chart…</p>}>
                  <SampleChart bars={bars} currency={format.currency} locale={format.locale} />
                </Suspense>
              </figure>
            )}
          </>
        )}
      </div>

      {hasPublished && (
        <div>
          <h3 className="font-bold">Recent inquiries</h3>
          <p className="max-w-prose text-sm text-slate">
            Prices every inquiry of the last 90 days again with the draft and with the published version, from the rooms the homeowner gave.
          </p>
          <button
            type="button"
            className="button-quiet mt-2"
            onClick={begin}
            disabled={!hydrated || starting || (current !== undefined && RUNNING.has(current.status))}
          >
            {current ? 'Replay again' : 'Replay the last 90 days'}
          </button>
          {failure && (
            <p role="alert" className="mt-2 text-brick">
              {failure}
            </p>
          )}
          {current && RUNNING.has(current.status) && (
            <div role="status" className="mt-3">
              <label htmlFor="replay-progress">
                {current.status === 'queued' ? 'Waiting to start…' : `Priced ${current.done} of ${current.total} inquiries…`}
              </label>
              <progress id="replay-progress" className="ml-2 align-middle" max={Math.max(current.total, 1)} value={current.done} />
            </div>
          )}
          {current?.status === 'failed' && (
            <p role="alert" className="mt-2 text-brick">
              The replay stopped: {current.failure ?? 'something went wrong on our side'}. Try again.
            </p>
          )}
          {current?.status === 'done' && current.summary && <ReplayResult summary={current.summary} money={money} />}
        </div>
      )}
    </section>
  );
}

function changeText(published: PricedSide | null, draft: PricedSide, money: (cents: number) => string): string {
  if (!published?.ok || !draft.ok) return '—';
  const change = draft.middleCents - published.middleCents;
  if (change === 0) return 'no change';
  const percent = published.middleCents === 0 ? 0 : (change / published.middleCents) * 100;
  return `${change > 0 ? '+' : '−'}${money(Math.abs(change))} (${change > 0 ? '+' : '−'}${Math.abs(percent).toFixed(1)} %)`;
}
