import { useId } from 'react';
import { countPhrase } from './count-phrase';

type Props = {
  label: string;
  value: number;
  onChange: (value: number) => void;
  max?: number;
  /** The item in the singular and plural ("window", "windows"), for what a screen reader hears. */
  item?: [string, string];
  /** Where the items are ("on Long wall 1"), when several counters share a label. */
  where?: string;
  compact?: boolean;
};

/** A small count with big minus and plus buttons, easy with a thumb; it announces "2 windows". */
export function Counter({ label, value, onChange, max = 20, item, where, compact = false }: Props) {
  const id = useId();
  const many = item?.[1] ?? label.toLowerCase();
  const said = item ? `${value} ${value === 1 ? item[0] : item[1]}` : countPhrase(value, label);
  const place = where ? ` ${where}` : '';
  const button = `${compact ? 'h-8 w-8' : 'h-9 w-9'} rounded-full border border-slate/40 text-lg leading-none disabled:opacity-40`;
  return (
    <div
      role="group"
      aria-labelledby={id}
      className={`flex items-center justify-between gap-2 rounded-md border border-slate/30 bg-white ${compact ? 'px-2 py-1' : 'px-3 py-2'}`}
    >
      <span id={id} className="text-sm font-medium">
        {label}
        {where && <span className="sr-only">{place}</span>}
      </span>
      <span className="flex items-center gap-2">
        <button type="button" className={button} aria-label={`Fewer ${many}${place}`} disabled={value <= 0} onClick={() => onChange(value - 1)}>
          −
        </button>
        <output className="figures w-6 text-center" aria-live="polite" aria-atomic="true">
          <span aria-hidden="true">{value}</span>
          <span className="sr-only">
            {said}
            {place}
          </span>
        </output>
        <button type="button" className={button} aria-label={`More ${many}${place}`} disabled={value >= max} onClick={() => onChange(value + 1)}>
          +
        </button>
      </span>
    </div>
  );
}
