import { useId } from 'react';
import { FIXTURE_KINDS, type FixtureKind } from '~/lib/estimate/schemas.ts';
import { Counter } from './Counter';
import type { WallItems } from './draft';

export const FIXTURE_LABELS: Record<FixtureKind, string> = {
  tub: 'Bathtub',
  shower: 'Shower stall',
  vanity: 'Vanity',
  toilet: 'Toilet',
  radiator: 'Radiator',
  'built-in': 'Built-in cabinet',
};

type Props = {
  items: WallItems;
  onChange: (items: WallItems) => void;
  /** "on Long wall 1", so each counter names its wall for a screen reader; empty for the whole room. */
  where?: string;
  withFixtures: boolean;
  compact?: boolean;
};

/** Doors, windows, outlets, switches and (for bathrooms, kitchens, laundries) fixtures: on one wall or the whole room. */
export function WallItemsEditor({ items, onChange, where, withFixtures, compact = false }: Props) {
  const id = useId();
  const set = (patch: Partial<WallItems>) => onChange({ ...items, ...patch });
  return (
    <div className="space-y-2">
      {/* One column on a phone: two counters side by side do not fit 320 px. */}
      <div className={`grid gap-2 ${compact ? 'min-[440px]:grid-cols-2' : 'sm:grid-cols-2'}`}>
        <Counter label="Doors" item={['door', 'doors']} where={where} compact={compact} value={items.doors} onChange={(doors) => set({ doors })} />
        <Counter label="Windows" item={['window', 'windows']} where={where} compact={compact} value={items.windows} onChange={(windows) => set({ windows })} />
        <Counter
          label="Outlets"
          item={['outlet', 'outlets']}
          where={where}
          compact={compact}
          value={items.outlets}
          onChange={(outlets) => set({ outlets })}
          max={40}
        />
        <Counter
          label="Switches"
          item={['light switch', 'light switches']}
          where={where}
          compact={compact}
          value={items.switches}
          onChange={(switches) => set({ switches })}
          max={40}
        />
      </div>
      {withFixtures && (
        <div className="flex flex-wrap items-center gap-2">
          {items.fixtures.map((kind, i) => (
            <span key={`${kind}-${i}`} className="inline-flex items-center gap-1 rounded-full border border-slate/40 bg-white px-2 py-1 text-sm">
              {FIXTURE_LABELS[kind]}
              <button
                type="button"
                className="h-6 w-6 rounded-full leading-none text-slate"
                aria-label={`Remove the ${FIXTURE_LABELS[kind].toLowerCase()}${where ? ` ${where}` : ''}`}
                onClick={() => set({ fixtures: items.fixtures.filter((_, j) => j !== i) })}
              >
                ×
              </button>
            </span>
          ))}
          {items.fixtures.length < 8 && (
            <>
              <label htmlFor={id} className="sr-only">
                Add a fixture{where ? ` ${where}` : ''}
              </label>
              <select
                id={id}
                className="field-input w-auto py-1 text-sm"
                value=""
                onChange={(event) => {
                  const kind = event.target.value as FixtureKind;
                  if (kind) set({ fixtures: [...items.fixtures, kind] });
                }}
              >
                <option value="">Add a fixture…</option>
                {FIXTURE_KINDS.map((kind) => (
                  <option key={kind} value={kind}>
                    {FIXTURE_LABELS[kind]}
                  </option>
                ))}
              </select>
            </>
          )}
        </div>
      )}
    </div>
  );
}
