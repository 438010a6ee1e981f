import { roomFrameFor, WallDrawing } from '~/components/drawing/WallDrawing';
import { formatMoney } from '~/lib/estimate/money.ts';
import { wallSummary } from '~/lib/estimate/summary.ts';
import type { HomeownerEstimate } from '~/lib/shared/homeowner-estimate';

/** The price range: the range, how it adds up, a drawing of every wall, and what to know. */
export function ResultView({ estimate, firmName, updating }: { estimate: HomeownerEstimate; firmName: string; updating: boolean }) {
  const money = (cents: number) => formatMoney(cents, estimate.currency, estimate.locale, { wholeUnits: true });
  return (
    <div className="space-y-6">
      <section aria-labelledby="range-heading" className="rounded-lg border border-slate/30 bg-white p-5 text-center">
        <h3 id="range-heading" className="text-sm font-medium text-slate">
          The range
        </h3>
        <p className={`figures mt-1 text-3xl font-bold ${updating ? 'opacity-50' : ''}`} data-testid="result-range" aria-busy={updating}>
          {estimate.range.text}
        </p>
        {updating && <p className="text-sm text-slate">Updating with your latest answers…</p>}
        <p className="mt-2 text-sm text-slate">{estimate.rangeReason}</p>
        {estimate.minimumApplied && <p className="mt-2 text-sm text-slate">{firmName} has a minimum job size, and this project is under it.</p>}
      </section>

      <section aria-labelledby="adds-heading">
        <h3 id="adds-heading" className="font-bold">
          How the middle of the range adds up
        </h3>
        <dl className="mt-2 divide-y divide-slate/20 rounded-lg border border-slate/20 bg-white">
          {estimate.groups.map((group) => (
            <div key={group.id} className="flex justify-between px-4 py-2 text-sm">
              <dt>{group.label}</dt>
              <dd className="figures font-medium">about {money(group.cents)}</dd>
            </div>
          ))}
          {/* The lines are rounded so they add up exactly to this figure (present-estimate.ts). */}
          <div className="flex justify-between px-4 py-2 text-sm font-bold" data-testid="result-middle">
            <dt>Total, the middle of the range</dt>
            <dd className="figures">about {money(estimate.middleCents)}</dd>
          </div>
        </dl>
        {estimate.extras.length > 0 && <p className="mt-2 text-xs text-slate">Extras included: {estimate.extras.join('; ')}.</p>}
      </section>

      <section aria-labelledby="walls-heading">
        <h3 id="walls-heading" className="font-bold">
          Your walls
        </h3>
        {estimate.rooms.map((room, r) => {
          // One scale for the room's walls, so a short wall is drawn shorter than a long one beside it.
          const frame = roomFrameFor(room.walls, estimate.units);
          return (
            <div key={r} className="mt-3">
              <h4 className="text-sm font-medium">
                {room.name}: {room.treatmentName}, {room.height === 'full' ? 'full height' : 'wainscot height'}, about{' '}
                <span className="figures">{Math.round(room.netSqFt)}</span> sq ft
              </h4>
              {/* One wall per row, so dimension labels stay readable at phone and iframe widths. */}
              <div className="mt-2 grid gap-3">
                {room.walls.map((wall, i) =>
                  wall.drawn === false ? (
                    // Past the answer's drawing budget (a very big project): the wall in words.
                    <p key={i} className="rounded-md border border-slate/20 bg-white p-2 text-sm" data-testid="wall-in-words">
                      {wallSummary(wall, estimate.units, room.treatmentName)}
                    </p>
                  ) : (
                    <figure key={i} className="rounded-md border border-slate/20 bg-white p-2" data-testid="result-wall">
                      <WallDrawing wall={wall} units={estimate.units} treatmentName={room.treatmentName} treatmentKind={room.treatmentKind} frame={frame} />
                      <figcaption className="mt-1 text-xs text-slate">{wall.label}</figcaption>
                    </figure>
                  ),
                )}
              </div>
            </div>
          );
        })}
        {estimate.rooms.some((room) => room.walls.some((wall) => wall.drawn === false)) && (
          <p className="mt-2 text-xs text-slate">Some walls are described in words rather than drawn, to keep this page quick for a project this size.</p>
        )}
        <details className="mt-3 text-sm">
          <summary className="cursor-pointer font-medium">What goes into it</summary>
          <ul className="mt-2 list-disc pl-5 text-slate">
            {estimate.materials.map((m, i) => (
              <li key={i}>
                <span className="figures">{m.quantity}</span> × {m.label}
              </li>
            ))}
          </ul>
        </details>
      </section>

      {estimate.cautions.length > 0 && (
        <section id="cautions" aria-labelledby="cautions-heading" className="rounded-lg border border-brick/40 bg-white p-4">
          <h3 id="cautions-heading" className="font-bold text-brick">
            Good to know before the work starts
          </h3>
          <ul className="mt-2 space-y-2 text-sm">
            {estimate.cautions.map((caution) => (
              <li key={caution.id}>
                <strong>{caution.title}.</strong> {caution.text}
              </li>
            ))}
          </ul>
        </section>
      )}
      <p className="text-sm text-slate">This is a rough range from your answers. {firmName} gives a firm price after measuring on site.</p>
    </div>
  );
}
