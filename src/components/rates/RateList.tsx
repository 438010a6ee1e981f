import { useState } from 'react';
import { get, useFieldArray, useFormContext, useFormState, useWatch } from 'react-hook-form';
import type { TreatmentKind } from '~/lib/estimate';
import { appliesToTreatment, rowFields, rowLists, TREATMENT_KIND_OPTIONS, type ListDescriptor } from '~/lib/shared/rate-book-fields';
import { inputIdOf, RateField } from './RateField';
import { newRow, newTreatment } from './new-rows';

type Props = {
  list: ListDescriptor;
  name: string;
  currency: string;
  /** Off when the list is its section's only entry, whose title already names it. */
  heading?: boolean;
};

const TREATMENTS = 'catalogue.treatments';
/** `catalogue.treatments.2` + `catalogue.treatments.*.source.sheetId` → `catalogue.treatments.2.source.sheetId`. */
const inRow = (rowName: string, list: ListDescriptor, pattern: string) => `${rowName}${pattern.slice(list.path.length + 2)}`;
const capitalised = (words: string) => words.charAt(0).toUpperCase() + words.slice(1);

/** A list of the Rate book (sheets, finishes, trip zones, containers …): its rows, and Add and Remove. */
export function RateList({ list, name, currency, heading = true }: Props) {
  const { control } = useFormContext();
  const { fields, append, remove } = useFieldArray({ control, name });
  const { errors } = useFormState({ name });
  const listError = get(errors, `${name}.root`) as { message?: string } | undefined;
  const full = fields.length >= list.max;

  return (
    <div id={inputIdOf(name)} className="sm:col-span-2 lg:col-span-3" tabIndex={-1}>
      {heading && <h4 className="text-sm font-bold">{list.label}</h4>}
      <p className="text-xs text-slate">{list.help}</p>
      {listError?.message && <p className="field-error">{listError.message}</p>}
      {fields.length > 0 && (
        <ol className="mt-2 space-y-3">
          {fields.map((row, index) => (
            <li key={row.id}>
              <RateRow list={list} name={`${name}.${index}`} index={index} currency={currency} onRemove={() => remove(index)} />
            </li>
          ))}
        </ol>
      )}
      {list.path === TREATMENTS ? (
        <AddTreatment disabled={full} onAdd={(kind) => append(newTreatment(kind))} />
      ) : (
        <button type="button" className="button-quiet mt-2 px-3 py-1 text-sm" disabled={full} onClick={() => append(newRow(name))}>
          Add {list.itemLabel}
        </button>
      )}
      {full && <p className="mt-1 text-xs text-slate">At most {list.max}.</p>}
    </div>
  );
}

function RateRow({ list, name, index, currency, onRemove }: { list: ListDescriptor; name: string; index: number; currency: string; onRemove: () => void }) {
  const [rowName, kind, from] = useWatch({ name: [`${name}.name`, `${name}.kind`, `${name}.source.from`] }) as [
    unknown,
    string | undefined,
    string | undefined,
  ];
  const title = `${capitalised(list.itemLabel)} ${index + 1}`;
  const fields = rowFields(list.path).filter((f) => list.path !== TREATMENTS || appliesToTreatment(f, kind, from));
  return (
    <fieldset className="rounded-md border border-slate/30 bg-white p-3">
      <legend className="px-1 text-sm font-medium">
        {title}
        {typeof rowName === 'string' && rowName !== '' && <span className="font-normal text-slate">: {rowName}</span>}
      </legend>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        {fields.map((field) => (
          <RateField key={field.path} field={field} name={inRow(name, list, field.path)} currency={currency} />
        ))}
        {rowLists(list.path).map((inner) => (
          <RateList key={inner.path} list={inner} name={inRow(name, list, inner.path)} currency={currency} />
        ))}
      </div>
      <button type="button" className="button-quiet mt-3 px-3 py-1 text-sm" onClick={onRemove}>
        Remove {list.itemLabel} {index + 1}
      </button>
    </fieldset>
  );
}

function AddTreatment({ disabled, onAdd }: { disabled: boolean; onAdd: (kind: TreatmentKind) => void }) {
  const [kind, setKind] = useState<TreatmentKind>('shiplap');
  return (
    <div className="mt-2 flex flex-wrap items-end gap-2">
      <div>
        <label htmlFor="rate-new-finish-kind" className="field-label">
          Kind of new finish
        </label>
        <select id="rate-new-finish-kind" className="field-input" value={kind} onChange={(e) => setKind(e.target.value as TreatmentKind)}>
          {TREATMENT_KIND_OPTIONS.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
      </div>
      <button type="button" className="button-quiet px-3 py-2 text-sm" disabled={disabled} onClick={() => onAdd(kind)}>
        Add finish
      </button>
    </div>
  );
}
