import { useState } from 'react';

/**
 * The firm's own widget as homeowners get it, framed from our origin (the embed page always allows
 * 'self'). It shows the saved colour and details; Reload fetches it again after a change.
 */
export function WidgetPreview({ src }: { src: string }) {
  const [round, setRound] = useState(0);
  return (
    <div className="mt-2 max-w-2xl">
      <button type="button" className="button-quiet px-2 py-1 text-sm" onClick={() => setRound((n) => n + 1)}>
        Reload the preview
      </button>
      <iframe key={round} src={src} title="Preview of your price widget" className="mt-2 h-[640px] w-full rounded-md border border-slate/30 bg-white" />
    </div>
  );
}
