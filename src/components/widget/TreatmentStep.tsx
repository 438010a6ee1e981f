import type { Units } from '~/lib/estimate/units.ts';
import { LengthField } from './LengthField';
import { TreatmentIcon } from './TreatmentIcon';
import type { Draft, FieldErrors } from './draft';

export type OfferedTreatment = { id: string; name: string; kind: string; orientation?: 'vertical' | 'horizontal' };

type Props = {
  treatments: OfferedTreatment[];
  draft: Draft;
  errors: FieldErrors;
  onChange: (patch: Partial<Draft>) => void;
  units: Units;
};

export function TreatmentStep({ treatments, draft, errors, onChange, units }: Props) {
  return (
    <div className="space-y-6">
      <fieldset>
        <legend className="text-base font-bold">What would you like on the walls?</legend>
        <div className="mt-3 grid gap-3 sm:grid-cols-2">
          {treatments.map((t) => (
            <label
              key={t.id}
              className={`choice-card flex cursor-pointer items-center gap-3 rounded-lg border bg-white p-3 ${draft.treatmentId === t.id ? 'border-2 border-[var(--brand)] bg-sawdust/30' : 'border-slate/30'}`}
            >
              <input type="radio" name="treatment" className="sr-only" checked={draft.treatmentId === t.id} onChange={() => onChange({ treatmentId: t.id })} />
              <TreatmentIcon kind={t.kind} orientation={t.orientation} />
              <span className="font-medium">{t.name}</span>
            </label>
          ))}
        </div>
        {errors['project.treatment'] && <p className="field-error">{errors['project.treatment']}</p>}
      </fieldset>

      <fieldset>
        <legend className="text-base font-bold">How high?</legend>
        <div className="mt-3 grid grid-cols-2 gap-2">
          {(['wainscot', 'full'] as const).map((height) => (
            <label
              key={height}
              className={`choice-card cursor-pointer rounded-md border px-3 py-3 text-sm ${draft.height === height ? 'border-2 border-[var(--brand)] bg-sawdust/30 font-medium' : 'border-slate/30 bg-white'}`}
            >
              <input type="radio" name="height" className="sr-only" checked={draft.height === height} onChange={() => onChange({ height })} />
              {height === 'wainscot' ? 'Lower wall, finished with a cap rail' : 'Full height, floor to ceiling'}
            </label>
          ))}
        </div>
        {draft.height === 'wainscot' && (
          <div className="mt-3 max-w-xs">
            <LengthField
              label="Height to the top of the cap rail"
              units={units}
              kind="wainscot-height"
              required
              value={draft.wainscotHeight}
              onChange={(wainscotHeight) => onChange({ wainscotHeight })}
              error={errors['project.wainscotHeight']}
              hint="About a third of the ceiling height is a common choice."
            />
          </div>
        )}
      </fieldset>
    </div>
  );
}
