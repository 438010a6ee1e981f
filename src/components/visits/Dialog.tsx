import { useEffect, useId, useRef, type ReactNode } from 'react';

type Props = {
  open: boolean;
  title: string;
  onClose: () => void;
  children: ReactNode;
};

/** A modal `<dialog>`: Escape closes it and focus goes back where it was. */
export function Dialog({ open, title, onClose, children }: Props) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  useEffect(() => {
    const element = ref.current;
    if (!element) return;
    if (open && !element.open) element.showModal();
    if (!open && element.open) element.close();
  }, [open]);
  return (
    <dialog ref={ref} onClose={onClose} aria-labelledby={titleId} className="w-full max-w-md rounded-md border border-slate/30 p-0 backdrop:bg-ink/40">
      {open && (
        <div className="p-4">
          <h2 id={titleId} className="font-bold">
            {title}
          </h2>
          <div className="mt-2">{children}</div>
        </div>
      )}
    </dialog>
  );
}
