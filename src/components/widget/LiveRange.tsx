import type { HomeownerEstimate } from '~/lib/shared/homeowner-estimate';
import type { ApiError } from './api';

/** What the range can say at any moment; exactly one of these holds. */
export type LiveRangeState =
  | { kind: 'range'; estimate: HomeownerEstimate; updating: boolean }
  | { kind: 'waiting'; what: string }
  | { kind: 'failed'; error: ApiError }
  | { kind: 'working' }
  | { kind: 'empty' };

/**
 * The live price range, as one line. It never shows a stale "appears here" when something is
 * wrong: it names what it waits for, or says the server failed and offers to try again.
 */
export function LiveRange({ state, onRetry, compact = false }: { state: LiveRangeState; onRetry: () => void; compact?: boolean }) {
  const small = compact ? 'text-xs' : 'text-sm';
  switch (state.kind) {
    case 'range':
      return (
        <span className={state.updating ? 'opacity-60' : ''}>
          <span className={`${small} text-slate`}>Price range so far: </span>
          <span className={`figures font-bold ${compact ? 'text-sm' : 'text-lg'}`}>{state.estimate.range.text}</span>
        </span>
      );
    case 'waiting':
      return (
        <span className={`${small} text-ink`}>
          <span className="font-medium">Waiting for:</span> {state.what}
        </span>
      );
    case 'failed':
      return (
        <span className={`${small} text-ink`}>
          {state.error.message}
          {state.error.retryable && !compact && (
            <>
              {' '}
              <button type="button" className="button-quiet ml-1 px-2 py-0.5 text-sm" onClick={onRetry}>
                Try again
              </button>
            </>
          )}
        </span>
      );
    case 'working':
      return <span className={`${small} text-slate`}>Working out your range…</span>;
    case 'empty':
      return <span className={`${small} text-slate`}>Your range appears here as you answer.</span>;
  }
}
