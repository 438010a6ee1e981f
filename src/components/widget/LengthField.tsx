import { useId } from 'react';
import type { Units } from '~/lib/estimate/units.ts';
import { lengthMessageInUnits } from './length-message';
import { inchesOrFeet, readBack, type LengthKind } from './length-readback';

type Props = {
  label: string;
  value: string;
  onChange: (value: string) => void;
  units: Units;
  /** What the field holds; sets the example placeholder and when to ask "inches or feet?". */
  kind: LengthKind;
  error?: string | undefined;
  /** The input's id; the widget moves focus to it when this field is the first one to fix. */
  id?: string;
  hint?: string;
  required?: boolean;
};

// Example sizes only, shown greyed out in an empty field; a room starts empty, never pre-filled.
const EXAMPLES: Record<LengthKind, Record<Units, string>> = {
  'room-length': { imperial: `12' 6"`, metric: '3800 mm' },
  'room-width': { imperial: `10'`, metric: '3050 mm' },
  'wall-length': { imperial: `9' 4"`, metric: '2850 mm' },
  'ceiling-height': { imperial: `8'`, metric: '2440 mm' },
  'wainscot-height': { imperial: '36"', metric: '900 mm' },
  'opening-width': { imperial: '32"', metric: '810 mm' },
  'opening-height': { imperial: '80"', metric: '2030 mm' },
  length: { imperial: `3' 3-1/2"`, metric: '1003 mm' },
};

/**
 * A length typed the way a tape reads (11' 4", 7 1/2 ft, 2,44 m). Under it the widget says how it was
 * read, asks "inches or feet?" when a bare number makes little sense for this field, and shows the
 * field's error in the homeowner's units with a red border.
 */
export function LengthField({ label, value, onChange, units, kind, error, id, hint, required = false }: Props) {
  const autoId = useId();
  const inputId = id ?? autoId;
  const read = readBack(value, units);
  const question = inchesOrFeet(value, units, kind);
  const message = error === undefined ? undefined : lengthMessageInUnits(error, units);
  const ids = {
    readback: `${inputId}-readback`,
    hint: `${inputId}-hint`,
    question: `${inputId}-question`,
    error: `${inputId}-error`,
  };
  const describedBy =
    [message ? ids.error : '', question ? ids.question : '', read.state === 'read' ? ids.readback : '', hint ? ids.hint : ''].filter(Boolean).join(' ') ||
    undefined;
  return (
    <div>
      <label htmlFor={inputId} className="field-label">
        {label}
        {required && <span className="font-normal text-slate"> (required)</span>}
      </label>
      <input
        id={inputId}
        className={`field-input figures ${message ? 'border-2 border-brick focus:border-brick' : ''}`}
        value={value}
        placeholder={`e.g. ${EXAMPLES[kind][units]}`}
        inputMode="text"
        autoComplete="off"
        aria-required={required ? true : undefined}
        aria-invalid={message ? true : undefined}
        aria-describedby={describedBy}
        onChange={(event) => onChange(event.target.value)}
      />
      {read.state === 'read' && (
        <p id={ids.readback} className="figures mt-1 text-xs text-slate">
          {read.text}
        </p>
      )}
      <div aria-live="polite">
        {question && (
          <div className="mt-1 flex flex-wrap items-center gap-2 text-sm">
            <span id={ids.question}>
              {units === 'metric' ? 'Millimetres or metres?' : 'Inches or feet?'} A number alone is read as {question.small.label}.
            </span>
            {[question.small, question.large].map((choice) => (
              <button key={choice.text} type="button" className="button-quiet px-2 py-1 text-sm" onClick={() => onChange(choice.text)}>
                {choice.label}
              </button>
            ))}
          </div>
        )}
      </div>
      {hint && (
        <p id={ids.hint} className="mt-1 text-xs text-slate">
          {hint}
        </p>
      )}
      {message && (
        <p id={ids.error} className="field-error">
          {message}
        </p>
      )}
    </div>
  );
}
