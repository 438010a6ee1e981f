/**
 * After a site visit has begun: the salesperson marks it done or no one home. Done opens the
 * measured rooms below (the page loads again to show them); no one home leaves the inquiry where it
 * is, to be booked again.
 */
import { useId, useState } from 'react';
import { VISIT_STATUS_LABELS } from '~/lib/shared/visit-schemas';
import { announceLeadChanged, asRequestFailed, sendJson, type FormStatus } from './api';
import { StatusLine } from './StatusLine';

export type VisitToMark = { id: string; /** e.g. "Tue, Dec 1, 2026, 9:00 AM CST with Sam Okafor" */ text: string };

type Outcome = 'done' | 'no-show';

export function VisitOutcome({ leadId, visits }: { leadId: string; visits: VisitToMark[] }) {
  const id = useId();
  const [open, setOpen] = useState(visits);
  const [busy, setBusy] = useState<string | null>(null);
  const [status, setStatus] = useState<FormStatus>(null);

  async function mark(visit: VisitToMark, outcome: Outcome) {
    setBusy(visit.id);
    setStatus(null);
    try {
      await sendJson('POST', `/api/app/visits/${visit.id}/outcome`, { outcome });
      if (outcome === 'done') {
        // The measured rooms are offered once a visit is done: the page shows them after loading again.
        window.location.reload();
        return;
      }
      setOpen((list) => list.filter((v) => v.id !== visit.id));
      setStatus({ kind: 'done', text: `Marked “${VISIT_STATUS_LABELS['no-show'].toLowerCase()}”. Book another visit when you have spoken to them.` });
      announceLeadChanged(leadId);
    } catch (error) {
      setStatus({ kind: 'failed', text: asRequestFailed(error).message });
    } finally {
      setBusy(null);
    }
  }

  if (!open.length && !status) return null;
  return (
    <section aria-labelledby={`${id}-h`} className="rounded border border-slate/20 bg-white p-4" data-testid="visit-outcome">
      <h2 id={`${id}-h`} className="font-bold">
        How did the visit go?
      </h2>
      <ul className="mt-2 space-y-3">
        {open.map((visit) => (
          <li key={visit.id} className="flex flex-wrap items-center gap-3">
            <span className="text-sm">{visit.text}</span>
            <button type="button" className="button-primary px-3 py-1.5" disabled={busy !== null} onClick={() => void mark(visit, 'done')}>
              Mark done
            </button>
            <button type="button" className="button-quiet px-3 py-1.5" disabled={busy !== null} onClick={() => void mark(visit, 'no-show')}>
              {VISIT_STATUS_LABELS['no-show']}
            </button>
          </li>
        ))}
      </ul>
      <div className="mt-2">
        <StatusLine status={status} />
      </div>
    </section>
  );
}
