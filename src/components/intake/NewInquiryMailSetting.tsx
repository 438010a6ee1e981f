import { useId, useState } from 'react';

/** The account page's switch for the firm's new-inquiry e-mails; saved as soon as it changes. */
export default function NewInquiryMailSetting({ initial, firmName }: { initial: boolean; firmName: string }) {
  const id = useId();
  const [on, setOn] = useState(initial);
  const [state, setState] = useState<'idle' | 'saving' | 'saved' | 'failed'>('idle');
  const change = async (next: boolean) => {
    setOn(next);
    setState('saving');
    try {
      const response = await fetch('/api/app/me/notifications', {
        method: 'PATCH',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ newInquiryMail: next }),
      });
      if (!response.ok) throw new Error(String(response.status));
      setState('saved');
    } catch {
      setOn(!next);
      setState('failed');
    }
  };
  return (
    <div>
      <label htmlFor={id} className="flex items-start gap-2 text-sm">
        <input id={id} type="checkbox" className="mt-0.5 h-5 w-5" checked={on} disabled={state === 'saving'} onChange={(e) => void change(e.target.checked)} />
        <span>E-mail me about each new inquiry at {firmName}</span>
      </label>
      <p role="status" className="mt-1 text-sm text-slate">
        {state === 'saving' ? 'Saving…' : state === 'saved' ? (on ? 'Saved: you will get them.' : 'Saved: you will not get them.') : ''}
      </p>
      {state === 'failed' && (
        <p role="alert" className="field-error">
          That was not saved. Please try again.
        </p>
      )}
    </div>
  );
}
