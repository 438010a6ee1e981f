import '~/lib/shared/zod-in-browser';
import { useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { firmVisitSettingsSchema, type FirmVisitSettings } from '~/lib/shared/visit-calendar';
import { asRequestFailed, sendJson, type FormStatus } from '~/components/inquiries/page/api';
import { StatusLine } from '~/components/inquiries/page/StatusLine';

type FormInput = z.input<typeof firmVisitSettingsSchema>;
type Props = { initial: FirmVisitSettings; zones: string[] };

const NUMBER_FIELDS = [
  { name: 'visitMinutes', label: 'Visit length', unit: 'minutes', hint: 'How long a site visit takes.' },
  { name: 'bufferMinutes', label: 'Travel time', unit: 'minutes', hint: 'Kept free before and after every visit.' },
  { name: 'stepMinutes', label: 'Start times every', unit: 'minutes', hint: 'Visits start on these marks from the start of each range of hours.' },
  { name: 'minNoticeMinutes', label: 'Least notice for homeowners', unit: 'minutes', hint: '1440 is a day. Staff booking for a caller may book sooner.' },
  { name: 'horizonDays', label: 'Homeowners may book up to', unit: 'days ahead', hint: '' },
] as const;

/** The firm's visit rules and time zone (Setup → Visits), checked by the same schema as the route. */
export function VisitSettingsForm({ initial, zones }: Props) {
  const ids = useId();
  const [status, setStatus] = useState<FormStatus>(null);
  const form = useForm<FormInput, unknown, FirmVisitSettings>({ resolver: zodResolver(firmVisitSettingsSchema), defaultValues: initial });
  const { register, handleSubmit, formState, setError, reset } = form;
  const errors = formState.errors;
  const aria = (name: keyof FormInput) =>
    errors[name] ? { 'aria-invalid': true as const, 'aria-describedby': `${ids}-${name}-error` } : { 'aria-describedby': `${ids}-${name}-hint` };

  const save = handleSubmit(async (values) => {
    setStatus(null);
    try {
      reset(await sendJson<FirmVisitSettings>('PUT', '/api/app/settings/visits', values));
      setStatus({ kind: 'done', text: 'Saved. New visit times follow these settings from now on.' });
    } catch (error) {
      const failed = asRequestFailed(error);
      for (const [path, message] of Object.entries(failed.fields)) setError(path as keyof FormInput, { message });
      setStatus({ kind: 'failed', text: failed.message });
    }
  });

  return (
    <form onSubmit={save} noValidate className="mt-4 max-w-lg space-y-4">
      {NUMBER_FIELDS.map((field) => (
        <div key={field.name}>
          <label htmlFor={`${ids}-${field.name}`} className="field-label">
            {field.label} <span className="font-normal text-slate">({field.unit})</span>
          </label>
          <input
            id={`${ids}-${field.name}`}
            type="number"
            inputMode="numeric"
            className="field-input figures max-w-40"
            {...register(field.name, { valueAsNumber: true })}
            {...aria(field.name)}
          />
          {field.hint && !errors[field.name] && (
            <p id={`${ids}-${field.name}-hint`} className="mt-1 text-xs text-slate">
              {field.hint}
            </p>
          )}
          {errors[field.name] && (
            <p id={`${ids}-${field.name}-error`} className="field-error">
              {errors[field.name]?.message}
            </p>
          )}
        </div>
      ))}

      <div>
        <label htmlFor={`${ids}-timeZone`} className="field-label">
          Time zone
        </label>
        <input
          id={`${ids}-timeZone`}
          className="field-input max-w-xs"
          list={`${ids}-zones`}
          autoComplete="off"
          {...register('timeZone')}
          {...aria('timeZone')}
        />
        <datalist id={`${ids}-zones`}>
          {zones.map((zone) => (
            <option key={zone} value={zone} />
          ))}
        </datalist>
        {errors.timeZone ? (
          <p id={`${ids}-timeZone-error`} className="field-error">
            {errors.timeZone.message}
          </p>
        ) : (
          <p id={`${ids}-timeZone-hint`} className="mt-1 text-xs text-slate">
            The clock of your office: hours, visits and every date in Lapwing are shown on it.
          </p>
        )}
      </div>

      <div className="flex items-start gap-2">
        <input id={`${ids}-onlineBooking`} type="checkbox" className="mt-1" {...register('onlineBooking')} />
        <label htmlFor={`${ids}-onlineBooking`}>
          Let homeowners choose a visit time after they send an inquiry
          <span className="block text-xs text-slate">They see open times of your team on your clock, with your time zone named.</span>
        </label>
      </div>

      <div className="flex items-center gap-3">
        <button type="submit" className="button-primary" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? 'Saving…' : 'Save visit settings'}
        </button>
        <StatusLine status={status} />
      </div>
    </form>
  );
}
