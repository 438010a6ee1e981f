import '~/lib/shared/zod-in-browser';
import { useId, useState } from 'react';
import { useFieldArray, useForm, type Control, type FieldErrors, type UseFormRegister } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { availabilitySchema, WEEKDAY_NAMES, WEEKDAYS, type Weekday } from '~/lib/shared/visit-schemas';
import type { AvailabilityView, CalendarPerson } from '~/lib/shared/visit-calendar';
import { asRequestFailed, getJson, sendJson, type FormStatus } from '~/components/inquiries/page/api';
import { StatusLine } from '~/components/inquiries/page/StatusLine';
import { dateHeading } from './calendar-time';

type FormInput = z.input<typeof availabilitySchema>;
type FormOutput = z.output<typeof availabilitySchema>;
type Values = { weekly: Record<Weekday, { from: string; to: string }[]>; daysOff: string[] };

type Props = {
  initial: AvailabilityView;
  /** Whose hours may be edited here: the owner's team, or the person alone. */
  people: CalendarPerson[];
  viewerMembershipId: string;
};

const WORKDAYS: Weekday[] = ['tue', 'wed', 'thu', 'fri'];
const NEW_RANGE = { from: '09:00', to: '17:00' };

function valuesOf(view: AvailabilityView): Values {
  return {
    weekly: Object.fromEntries(WEEKDAYS.map((day) => [day, (view.weekly[day] ?? []).map((r) => ({ ...r }))])) as Values['weekly'],
    daysOff: [...view.daysOff],
  };
}

/** Weekly hours per weekday (several ranges a day) and days off, checked by the same schema as the route. */
export function HoursForm({ initial, people, viewerMembershipId }: Props) {
  const ids = useId();
  const [whose, setWhose] = useState(initial.membershipId);
  const [status, setStatus] = useState<FormStatus>(null);
  const [newDayOff, setNewDayOff] = useState('');
  const [dayOffError, setDayOffError] = useState<string | null>(null);
  const form = useForm<FormInput, unknown, FormOutput>({ resolver: zodResolver(availabilitySchema), defaultValues: valuesOf(initial) });
  const { control, register, handleSubmit, formState, setError, reset, getValues, setValue, watch } = form;
  const daysOff = watch('daysOff');
  const errors = formState.errors;
  const name = people.find((p) => p.id === whose)?.name ?? initial.name;

  async function choosePerson(membershipId: string) {
    setStatus(null);
    setWhose(membershipId);
    try {
      reset(valuesOf(await getJson<AvailabilityView>(`/api/app/visits/availability/${membershipId}`)));
      const query = new URLSearchParams(window.location.search);
      query.set('person', membershipId);
      window.history.replaceState(null, '', `${window.location.pathname}?${query}`);
    } catch (error) {
      setStatus({ kind: 'failed', text: asRequestFailed(error).message });
    }
  }

  function copyMonday() {
    const monday = getValues('weekly.mon') ?? [];
    for (const day of WORKDAYS)
      setValue(
        `weekly.${day}`,
        monday.map((r) => ({ ...r })),
        { shouldDirty: true },
      );
    setStatus({ kind: 'done', text: 'Monday’s hours copied to Tuesday through Friday. Save to keep them.' });
  }

  function addDayOff() {
    if (!/^\d{4}-\d{2}-\d{2}$/.test(newDayOff)) return setDayOffError('Choose a date.');
    setDayOffError(null);
    setValue('daysOff', [...new Set([...(daysOff ?? []), newDayOff])].sort(), { shouldDirty: true });
    setNewDayOff('');
  }

  const save = handleSubmit(async (values) => {
    setStatus(null);
    try {
      reset(valuesOf(await sendJson<AvailabilityView>('PUT', `/api/app/visits/availability/${whose}`, values)));
      setStatus({ kind: 'done', text: whose === viewerMembershipId ? 'Your hours are saved.' : `${name}’s hours are saved.` });
    } catch (error) {
      const failed = asRequestFailed(error);
      for (const [path, message] of Object.entries(failed.fields)) setError(path as never, { message });
      setStatus({ kind: 'failed', text: failed.message });
    }
  });

  return (
    <form onSubmit={save} noValidate className="mt-4 max-w-2xl space-y-6">
      {people.length > 1 && (
        <div className="max-w-xs">
          <label htmlFor={`${ids}-whose`} className="field-label">
            Whose hours
          </label>
          <select id={`${ids}-whose`} className="field-input" value={whose} onChange={(e) => void choosePerson(e.target.value)}>
            {people.map((p) => (
              <option key={p.id} value={p.id}>
                {p.name}
                {p.id === viewerMembershipId ? ' (you)' : ''}
              </option>
            ))}
          </select>
        </div>
      )}

      <fieldset className="space-y-3">
        <legend className="font-bold">Weekly hours</legend>
        {WEEKDAYS.map((day) => (
          <DayHours key={day} day={day} control={control} register={register} errors={errors} ids={ids} />
        ))}
        <button type="button" className="button-quiet px-3 py-1 text-sm" onClick={copyMonday}>
          Copy Monday to Tuesday–Friday
        </button>
      </fieldset>

      <fieldset className="space-y-2">
        <legend className="font-bold">Days off</legend>
        <p className="text-sm text-slate">No visits are offered on these dates.</p>
        <div className="flex items-end gap-2">
          <div>
            <label htmlFor={`${ids}-day-off`} className="field-label">
              Date
            </label>
            <input
              id={`${ids}-day-off`}
              type="date"
              className="field-input"
              value={newDayOff}
              onChange={(e) => setNewDayOff(e.target.value)}
              aria-invalid={dayOffError ? true : undefined}
              aria-describedby={dayOffError ? `${ids}-day-off-error` : undefined}
            />
          </div>
          <button type="button" className="button-quiet mb-0.5 px-3" onClick={addDayOff}>
            Add day off
          </button>
        </div>
        {dayOffError && (
          <p id={`${ids}-day-off-error`} className="field-error">
            {dayOffError}
          </p>
        )}
        {daysOff && daysOff.length > 0 ? (
          <ul className="space-y-1" data-testid="days-off">
            {daysOff.map((date, index) => (
              <li key={date} className="flex items-center gap-3 text-sm">
                <span className="figures">
                  {dateHeading(date)}, {date.slice(0, 4)}
                </span>
                <button
                  type="button"
                  className="text-brick underline"
                  onClick={() =>
                    setValue(
                      'daysOff',
                      (getValues('daysOff') ?? []).filter((d) => d !== date),
                      { shouldDirty: true },
                    )
                  }
                  aria-label={`Remove day off ${dateHeading(date)}, ${date.slice(0, 4)}`}
                >
                  Remove
                </button>
                {errors.daysOff?.[index]?.message && <span className="field-error mt-0">{errors.daysOff[index]?.message}</span>}
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-sm text-slate">No days off.</p>
        )}
        {errors.daysOff?.message && <p className="field-error">{errors.daysOff.message}</p>}
      </fieldset>

      <div className="flex items-center gap-3">
        <button type="submit" className="button-primary" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? 'Saving…' : 'Save hours'}
        </button>
        <StatusLine status={status} />
      </div>
    </form>
  );
}

type DayProps = {
  day: Weekday;
  control: Control<FormInput, unknown, FormOutput>;
  register: UseFormRegister<FormInput>;
  errors: FieldErrors<FormInput>;
  ids: string;
};

/** One weekday's ranges: add, change, remove. */
function DayHours({ day, control, register, errors, ids }: DayProps) {
  const { fields, append, remove } = useFieldArray({ control, name: `weekly.${day}` });
  const dayErrors = errors.weekly?.[day];
  return (
    <div className="rounded-md border border-slate/20 bg-white p-3" role="group" aria-labelledby={`${ids}-${day}`} data-testid={`hours-${day}`}>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 id={`${ids}-${day}`} className="font-medium">
          {WEEKDAY_NAMES[day]}
        </h3>
        <button type="button" className="text-sm text-lapwing underline" onClick={() => append({ ...NEW_RANGE })} disabled={fields.length >= 6}>
          Add hours on {WEEKDAY_NAMES[day]}
        </button>
      </div>
      {fields.length === 0 && <p className="text-sm text-slate">No visits.</p>}
      <ul className="mt-1 space-y-2">
        {fields.map((field, index) => {
          const rangeErrors = dayErrors?.[index];
          const fromId = `${ids}-${day}-${index}-from`;
          const toId = `${ids}-${day}-${index}-to`;
          return (
            <li key={field.id}>
              <div className="flex flex-wrap items-end gap-2">
                <div>
                  <label htmlFor={fromId} className="field-label">
                    From{' '}
                    <span className="sr-only">
                      ({WEEKDAY_NAMES[day]}, range {index + 1})
                    </span>
                  </label>
                  <input
                    id={fromId}
                    type="time"
                    className="field-input figures"
                    {...register(`weekly.${day}.${index}.from`)}
                    aria-invalid={rangeErrors?.from ? true : undefined}
                    aria-describedby={rangeErrors?.from ? `${fromId}-error` : undefined}
                  />
                </div>
                <div>
                  <label htmlFor={toId} className="field-label">
                    To{' '}
                    <span className="sr-only">
                      ({WEEKDAY_NAMES[day]}, range {index + 1})
                    </span>
                  </label>
                  <input
                    id={toId}
                    type="time"
                    className="field-input figures"
                    {...register(`weekly.${day}.${index}.to`)}
                    aria-invalid={rangeErrors?.to ? true : undefined}
                    aria-describedby={rangeErrors?.to ? `${toId}-error` : undefined}
                  />
                </div>
                <button
                  type="button"
                  className="button-quiet mb-0.5 px-3 py-1.5 text-sm"
                  onClick={() => remove(index)}
                  aria-label={`Remove ${WEEKDAY_NAMES[day]} range ${index + 1}`}
                >
                  Remove
                </button>
              </div>
              {rangeErrors?.from?.message && (
                <p id={`${fromId}-error`} className="field-error">
                  {rangeErrors.from.message}
                </p>
              )}
              {rangeErrors?.to?.message && (
                <p id={`${toId}-error`} className="field-error">
                  {rangeErrors.to.message}
                </p>
              )}
            </li>
          );
        })}
      </ul>
      {dayErrors?.message && <p className="field-error">{dayErrors.message}</p>}
    </div>
  );
}
