import { get, useFormContext, useFormState, useWatch } from 'react-hook-form';
import { unitText, type FieldDescriptor, type ReferenceList } from '~/lib/shared/rate-book-fields';

type Props = {
  field: FieldDescriptor;
  /** The concrete path of this input in the form (`catalogue.sheets.2.priceCents`). */
  name: string;
  currency: string;
};

/** The DOM id of a field's input, from its path (also the target of the error summary's links). */
export const inputIdOf = (name: string) => `rate-${name.replace(/[^a-zA-Z0-9-]/g, '_')}`;

const NUMBER_KINDS = new Set(['money', 'percent', 'hours', 'inches', 'count', 'number']);

/**
 * One field of the Rate book: its label, the input its kind needs, its unit, its help line or message.
 * Inputs keep a scroll margin the height of the sticky Save bar, so a focused field is never under it.
 */
export function RateField({ field, name, currency }: Props) {
  const { register } = useFormContext();
  const { errors } = useFormState({ name });
  const message = (get(errors, name) as { message?: string } | undefined)?.message;
  const id = inputIdOf(name);
  const describedBy = message ? `${id}-error ${id}-help` : `${id}-help`;
  const aria = { 'aria-describedby': describedBy, ...(message ? { 'aria-invalid': true as const } : {}) };
  const unit = unitText(field, currency);

  if (field.kind === 'flag') {
    return (
      <div className="flex items-start gap-2 sm:col-span-2">
        <input id={id} type="checkbox" className="mt-1 scroll-mb-48" {...register(name)} {...aria} />
        <div>
          <label htmlFor={id}>{field.label}</label>
          <FieldNotes id={id} help={field.help} message={message} />
        </div>
      </div>
    );
  }

  let input;
  if (NUMBER_KINDS.has(field.kind)) {
    input = (
      <input
        id={id}
        type="number"
        step="any"
        inputMode={field.kind === 'count' ? 'numeric' : 'decimal'}
        className="field-input figures max-w-36 scroll-mb-48"
        {...register(name, { valueAsNumber: true })}
        {...aria}
      />
    );
  } else if (field.kind === 'choice') {
    input = (
      <select id={id} className="field-input max-w-xs scroll-mb-48" {...register(name)} {...aria}>
        {field.optional && <option value="">Not set (the usual)</option>}
        {field.options!.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    );
  } else if (field.kind === 'reference') {
    input = <ReferenceSelect id={id} name={name} field={field} aria={aria} />;
  } else {
    input = <input id={id} type="text" className="field-input max-w-xs scroll-mb-48" autoComplete="off" {...register(name)} {...aria} />;
  }

  return (
    <div>
      <label htmlFor={id} className="field-label">
        {field.label}
        {unit && <span className="sr-only"> ({unit})</span>}
      </label>
      <div className="flex items-center gap-2">
        {input}
        {unit && (
          <span className="mt-1 text-sm text-slate" aria-hidden="true">
            {unit}
          </span>
        )}
      </div>
      <FieldNotes id={id} help={field.help} message={message} />
    </div>
  );
}

/** The message, when there is one, and the help line. */
function FieldNotes({ id, help, message }: { id: string; help: string; message?: string }) {
  return (
    <>
      {message && (
        <p id={`${id}-error`} className="field-error">
          {message}
        </p>
      )}
      <p id={`${id}-help`} className="mt-1 text-xs text-slate">
        {help}
      </p>
    </>
  );
}

type Row = { id?: string; name?: string };
const LIST_PATHS: Record<ReferenceList, string> = {
  sheets: 'catalogue.sheets',
  boards: 'catalogue.boards',
  mouldings: 'catalogue.mouldings',
  treatments: 'catalogue.treatments',
};
const LIST_WORDS: Record<ReferenceList, string> = { sheets: 'Sheets', boards: 'Boards', mouldings: 'Mouldings', treatments: 'Finishes' };

/** A choice among the rows of this very Rate book, as they stand in the form (so a new row can be picked at once). */
function ReferenceSelect({ id, name, field, aria }: { id: string; name: string; field: FieldDescriptor; aria: Record<string, unknown> }) {
  const { register } = useFormContext();
  const lists = field.refersTo!;
  const rowsByList = useWatch({ name: lists.map((l) => LIST_PATHS[l]) }) as (Row[] | undefined)[];
  const current = useWatch({ name }) as string | undefined;
  const known = new Set(rowsByList.flatMap((rows) => (rows ?? []).map((r) => r.id)));
  return (
    <select id={id} className="field-input max-w-xs scroll-mb-48" {...register(name)} {...aria}>
      <option value="">{field.optional ? 'None' : 'Choose…'}</option>
      {current && !known.has(current) && <option value={current}>{current} (not in the lists)</option>}
      {lists.map((list, i) => (
        <optgroup key={list} label={LIST_WORDS[list]}>
          {(rowsByList[i] ?? [])
            .filter((r) => r.id)
            .map((r) => (
              <option key={r.id} value={r.id}>
                {r.name ? `${r.name} (${r.id})` : r.id}
              </option>
            ))}
        </optgroup>
      ))}
    </select>
  );
}
