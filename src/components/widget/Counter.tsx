import { useId } from 'react';
import { countPhrase } from './count-phrase';

type Props = { label: string; value: number; onChange: (value: number) => void; max?: number };

/** A small count with big minus and plus buttons, easy with a thumb. */
export function Counter({ label, value, onChange, max = 20 }: Props) {
  const id = useId();
  return (
    <div role="group" aria-labelledby={id} className="flex items-center justify-between gap-2 rounded-md border border-slate/30 bg-white px-3 py-2">
      <span id={id} className="text-sm font-medium">
        {label}
      </span>
      <span className="flex items-center gap-2">
        <button
          type="button"
          className="h-9 w-9 rounded-full border border-slate/40 text-lg leading-none disabled:opacity-40"
          aria-label={`Fewer ${label.toLowerCase()}`}
          disabled={value <= 0}
          onClick={() => onChange(value - 1)}
        >
          −
        </button>
        {/* Announced with its item ("2 windows"), not as a bare number. */}
        <output className="figures w-6 text-center" aria-live="polite" aria-atomic="true">
          <span aria-hidden="true">{value}</span>
          <span className="sr-only">{countPhrase(value, label)}</span>
        </output>
        <button
          type="button"
          className="h-9 w-9 rounded-full border border-slate/40 text-lg leading-none disabled:opacity-40"
          aria-label={`More ${label.toLowerCase()}`}
          disabled={value >= max}
          onClick={() => onChange(value + 1)}
        >
          +
        </button>
      </span>
    </div>
  );
}
