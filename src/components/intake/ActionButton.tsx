import { useState } from 'react';

type Props = {
  label: string;
  busyLabel: string;
  method: 'POST' | 'DELETE';
  url: string;
  body?: unknown;
  /** Asked first; the action runs only if the person agrees. */
  confirm?: string;
  tone?: 'quiet' | 'danger';
  testId?: string;
};

/**
 * One staff action on an inquiry (delete, restore, merge): calls its JSON route and, once done,
 * opens the page the answer names (`url`). A refusal is shown beside the button.
 */
export default function ActionButton({ label, busyLabel, method, url, body, confirm, tone = 'quiet', testId }: Props) {
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const run = async () => {
    if (confirm && !window.confirm(confirm)) return;
    setBusy(true);
    setProblem(null);
    try {
      const response = await fetch(url, {
        method,
        headers: body === undefined ? {} : { 'content-type': 'application/json' },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      const answer = (await response.json().catch(() => ({}))) as { url?: string; error?: string; fields?: Record<string, string> };
      if (!response.ok) {
        setProblem(Object.values(answer.fields ?? {})[0] ?? answer.error ?? 'That did not work. Please try again.');
        return;
      }
      window.location.assign(answer.url ?? window.location.href);
    } catch {
      setProblem('We could not reach Lapwing. Check the connection and try again.');
    } finally {
      setBusy(false);
    }
  };
  return (
    <span className="inline-flex flex-col items-start gap-1">
      <button
        type="button"
        className={tone === 'danger' ? 'button-quiet border-brick/50 text-brick' : 'button-quiet'}
        disabled={busy}
        onClick={() => void run()}
        data-testid={testId}
      >
        {busy ? busyLabel : label}
      </button>
      {problem && (
        <span role="alert" className="field-error">
          {problem}
        </span>
      )}
    </span>
  );
}
