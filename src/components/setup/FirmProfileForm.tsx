import '~/lib/shared/zod-in-browser';
import { useEffect, useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { AA_TEXT_CONTRAST, brandTextContrast, formatRatio } from '~/lib/shared/contrast';
import { brandContrastMessage, firmProfileSchema, type FirmProfile, type FirmProfileInput } from '~/lib/shared/setup-schemas';
import { asRequestFailed, sendJson, type FormStatus } from '~/components/inquiries/page/api';
import { StatusLine } from '~/components/inquiries/page/StatusLine';
import { SetupField } from './SetupField';

type Props = { initial: FirmProfile; zones: string[] };

const TEXT_FIELDS = [
  { name: 'name', label: 'Firm name', hint: 'As homeowners see it in the widget and in e-mails.', autoComplete: 'organization' },
  { name: 'phone', label: 'Phone', hint: 'Shown to homeowners in the widget and e-mails. Leave blank for none.', autoComplete: 'tel', type: 'tel' },
  { name: 'contactEmail', label: 'Reply address', hint: 'Where homeowners’ replies to our e-mails reach you.', autoComplete: 'email', type: 'email' },
  { name: 'website', label: 'Website', hint: 'The full address, like https://www.example.com.', autoComplete: 'url', type: 'url' },
  { name: 'addressStreet', label: 'Street', autoComplete: 'street-address' },
  { name: 'addressCity', label: 'Town or city', autoComplete: 'address-level2' },
  { name: 'addressRegion', label: 'State', autoComplete: 'address-level1' },
  { name: 'addressPostcode', label: 'ZIP code', hint: 'A service area given as a distance is measured from here.', autoComplete: 'postal-code' },
] as const;

/** Blank fields are sent as "" and stored as none; the form shows none as "". */
const asFormValues = (profile: FirmProfile): FirmProfileInput =>
  Object.fromEntries(Object.entries(profile).map(([key, value]) => [key, value ?? ''])) as FirmProfileInput;

/** The firm's profile (Setup → Firm profile), checked by the same schema as its route. */
export function FirmProfileForm({ initial, zones }: Props) {
  const ids = useId();
  const [status, setStatus] = useState<FormStatus>(null);
  const [ready, setReady] = useState(false);
  useEffect(() => setReady(true), []);
  const form = useForm<FirmProfileInput, unknown, FirmProfile>({ resolver: zodResolver(firmProfileSchema), defaultValues: asFormValues(initial) });
  const { register, handleSubmit, formState, setError, reset, watch, setValue } = form;
  const errors = formState.errors;
  const colour = watch('brandColor') ?? '';

  const save = handleSubmit(async (values) => {
    setStatus(null);
    try {
      reset(asFormValues(await sendJson<FirmProfile>('PUT', '/api/app/settings/profile', values)));
      setStatus({ kind: 'done', text: 'Saved. The widget and new e-mails use these details from now on.' });
    } catch (error) {
      const failed = asRequestFailed(error);
      for (const [path, message] of Object.entries(failed.fields)) setError(path as keyof FirmProfileInput, { message });
      setStatus({ kind: 'failed', text: failed.message });
    }
  });

  return (
    <form onSubmit={save} noValidate className="mt-4 max-w-lg space-y-4" data-ready={ready ? 'true' : undefined}>
      {TEXT_FIELDS.map((field) => (
        <SetupField
          key={field.name}
          id={`${ids}-${field.name}`}
          label={field.label}
          hint={'hint' in field ? field.hint : undefined}
          error={errors[field.name]?.message}
          input={{ type: 'type' in field ? field.type : 'text', autoComplete: field.autoComplete, ...register(field.name) }}
        />
      ))}

      <div>
        <SetupField
          id={`${ids}-timeZone`}
          label="Time zone"
          hint="The clock of your office: hours, visits and every date in Lapwing are shown on it."
          error={errors.timeZone?.message}
          input={{ list: `${ids}-zones`, autoComplete: 'off', className: 'field-input max-w-xs', ...register('timeZone') }}
        />
        <datalist id={`${ids}-zones`}>
          {zones.map((zone) => (
            <option key={zone} value={zone} />
          ))}
        </datalist>
      </div>

      <fieldset className="space-y-2">
        <legend className="field-label">Brand colour</legend>
        <div className="flex items-center gap-3">
          <input
            type="color"
            aria-label="Pick the brand colour"
            className="h-9 w-12 cursor-pointer rounded border border-slate/40"
            value={/^#[0-9A-Fa-f]{6}$/.test(colour) ? colour : '#000000'}
            onChange={(event) => setValue('brandColor', event.target.value.toUpperCase(), { shouldDirty: true })}
          />
          <label htmlFor={`${ids}-brandColor`} className="sr-only">
            Brand colour as #RRGGBB
          </label>
          <input
            id={`${ids}-brandColor`}
            className="field-input figures max-w-32"
            autoComplete="off"
            spellCheck={false}
            aria-invalid={errors.brandColor ? true : undefined}
            aria-describedby={`${ids}-contrast`}
            {...register('brandColor')}
          />
        </div>
        <ContrastReadout id={`${ids}-contrast`} colour={colour} />
        {errors.brandColor && !brandTextContrast(colour.trim()) && <p className="field-error">{errors.brandColor.message}</p>}
      </fieldset>

      <div className="flex items-center gap-3">
        <button type="submit" className="button-primary" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? 'Saving…' : 'Save firm profile'}
        </button>
        <StatusLine status={status} />
      </div>
    </form>
  );
}

/**
 * The widget's main button in the colour as it is typed, with the contrast its text reaches
 * (WCAG 2.2 SC 1.4.3, `~/lib/shared/contrast`). A colour short of 4.5:1 says so at once; the same
 * words come back from the server if it is sent anyway.
 */
function ContrastReadout({ id, colour }: { id: string; colour: string }) {
  const best = brandTextContrast(colour.trim());
  if (!best) {
    return (
      <p id={id} className="text-xs text-slate" data-testid="brand-contrast">
        Write the colour like #2F6B4F, or pick it.
      </p>
    );
  }
  const passes = best.ratio >= AA_TEXT_CONTRAST;
  return (
    <div id={id} className="flex flex-wrap items-center gap-3" aria-live="polite" data-testid="brand-contrast">
      <span className="rounded-md px-4 py-2 text-sm font-semibold" style={{ background: colour.trim(), color: best.text }}>
        See my price
      </span>
      {passes ? (
        <span className="text-sm text-lapwing">
          {best.text === '#FFFFFF' ? 'White' : 'Dark'} text reaches {formatRatio(best.ratio)}: meets WCAG 2.2 AA (4.5:1).
        </span>
      ) : (
        <span className="field-error m-0">{brandContrastMessage(best.ratio)}</span>
      )}
    </div>
  );
}
