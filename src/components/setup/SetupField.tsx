import type { InputHTMLAttributes, ReactNode } from 'react';

type Props = {
  id: string;
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  input: InputHTMLAttributes<HTMLInputElement>;
};

/** A labelled text input of a Setup form with its hint, or its field message in place of the hint. */
export function SetupField({ id, label, hint, error, input }: Props) {
  const described = error ? `${id}-error` : hint ? `${id}-hint` : undefined;
  return (
    <div>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      <input id={id} className="field-input" aria-invalid={error ? true : undefined} aria-describedby={described} {...input} />
      {error ? (
        <p id={`${id}-error`} className="field-error">
          {error}
        </p>
      ) : (
        hint && (
          <p id={`${id}-hint`} className="mt-1 text-xs text-slate">
            {hint}
          </p>
        )
      )}
    </div>
  );
}

/** Set once the island runs in the browser, so a browser test types only into the hydrated form. */
export const READY_ATTRIBUTE = 'data-ready';
