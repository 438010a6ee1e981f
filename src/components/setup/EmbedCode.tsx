import { useEffect, useRef, useState } from 'react';

/** The snippet a firm pastes into its site, with a copy button (the text stays selectable without one). */
export function EmbedCode({ code }: { code: string }) {
  const [copied, setCopied] = useState<'yes' | 'no' | null>(null);
  const [ready, setReady] = useState(false);
  const area = useRef<HTMLTextAreaElement>(null);
  useEffect(() => setReady(true), []);

  async function copy() {
    try {
      await navigator.clipboard.writeText(code);
      setCopied('yes');
    } catch (error) {
      // No clipboard permission (or an insecure page): select the text so Ctrl+C copies it.
      if (!(error instanceof Error)) throw error;
      area.current?.select();
      setCopied('no');
    }
  }

  return (
    <div className="mt-2 max-w-2xl" data-ready={ready ? 'true' : undefined}>
      <label htmlFor="embed-code" className="sr-only">
        Embed code
      </label>
      <textarea id="embed-code" ref={area} readOnly rows={2} className="field-input figures w-full font-mono text-xs" value={code} />
      <div className="mt-1 flex items-center gap-3">
        <button type="button" className="button-quiet px-2 py-1 text-sm" onClick={copy}>
          Copy the code
        </button>
        <p role="status" className="text-sm text-slate">
          {copied === 'yes' ? 'Copied.' : copied === 'no' ? 'Selected: press Ctrl+C (⌘C on a Mac) to copy it.' : ''}
        </p>
      </div>
    </div>
  );
}
