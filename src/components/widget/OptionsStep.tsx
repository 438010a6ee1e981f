import { isDamp, type Draft, type FieldErrors, type RoomDraft } from './draft';

type Props = {
  draft: Draft;
  errors: FieldErrors;
  onChange: (patch: Partial<Draft>) => void;
  onRoomsChange: (rooms: RoomDraft[]) => void;
  /** Off where the answer is already known (rooms measured on a site visit). */
  askHowMeasured?: boolean;
};

function Choice<T extends string>({
  legend,
  name,
  value,
  options,
  onChange,
  error,
  required = false,
}: {
  legend: string;
  name: string;
  /** Null while nothing is picked. */
  value: T | null;
  options: [T, string][];
  onChange: (v: T) => void;
  error?: string | undefined;
  required?: boolean;
}) {
  const errorId = `${name}-error`;
  return (
    <fieldset aria-describedby={error ? errorId : undefined} aria-invalid={error ? true : undefined}>
      <legend className="field-label">
        {legend}
        {required && <span className="text-slate"> (required)</span>}
      </legend>
      {error && (
        <p id={errorId} className="field-error">
          {error}
        </p>
      )}
      <div className={`mt-1 flex flex-wrap gap-2 ${error ? 'rounded-md outline outline-2 outline-offset-2 outline-brick' : ''}`}>
        {options.map(([option, label]) => (
          <label
            key={option}
            className={`choice-card cursor-pointer rounded-md border px-3 py-2 text-sm ${value === option ? 'border-2 border-[var(--brand)] bg-sawdust/30 font-medium' : 'border-slate/30 bg-white'}`}
          >
            <input type="radio" className="sr-only" name={name} required={required} checked={value === option} onChange={() => onChange(option)} />
            {label}
          </label>
        ))}
      </div>
    </fieldset>
  );
}

export function OptionsStep({ draft, errors, onChange, onRoomsChange, askHowMeasured = true }: Props) {
  const yesNo: ['yes' | 'no', string][] = [
    ['yes', 'Yes'],
    ['no', 'No'],
  ];
  return (
    <div className="space-y-5">
      <Choice
        legend="Replace the baseboard too?"
        name="baseboard"
        value={draft.replaceBaseboard ? 'yes' : 'no'}
        options={yesNo}
        onChange={(v) => onChange({ replaceBaseboard: v === 'yes' })}
      />
      <Choice
        legend="Should the firm prime and paint the new work?"
        name="paint"
        value={draft.paint ? 'yes' : 'no'}
        options={yesNo}
        onChange={(v) => onChange({ paint: v === 'yes' })}
      />
      <Choice
        legend="Was the home built before 1978?"
        name="built"
        value={draft.builtBefore1978}
        options={[
          ['yes', 'Yes'],
          ['no', 'No'],
          ['not-sure', 'Not sure'],
        ]}
        onChange={(builtBefore1978) => onChange({ builtBefore1978 })}
        required
        error={errors['project.builtBefore1978']}
      />
      {askHowMeasured && (
        <Choice
          legend="How did you get the sizes?"
          name="measured"
          value={draft.measuredBy}
          options={[
            ['homeowner-estimate', 'My best guess'],
            ['homeowner-tape', 'I measured with a tape'],
          ]}
          onChange={(measuredBy) => onChange({ measuredBy })}
        />
      )}
      <fieldset>
        <legend className="field-label">Which rooms get damp? (bathrooms, laundry)</legend>
        <div className="mt-1 space-y-1">
          {draft.rooms.map((room, i) => (
            <label key={room.key} className="flex items-center gap-2 text-sm">
              <input
                type="checkbox"
                className="h-5 w-5 accent-[var(--brand)]"
                checked={isDamp(room)}
                onChange={(event) => onRoomsChange(draft.rooms.map((x, j) => (j === i ? { ...x, damp: event.target.checked } : x)))}
              />
              {room.name || `Room ${i + 1}`}
            </label>
          ))}
        </div>
      </fieldset>
    </div>
  );
}
