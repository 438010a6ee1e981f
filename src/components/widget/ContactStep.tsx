import { useId } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { contactSchema, type ContactInput } from '~/lib/shared/lead-schemas';

/** The words that change when staff fill the form in for a homeowner on the phone. */
export type ContactWording = { name: string; reach: string; consent: string; submit: string; sending: string };

type Props = {
  firmName: string;
  sending: boolean;
  serverErrors: Record<string, string>;
  onSubmit: (contact: ContactInput, honeypot: string) => void;
  /** Staff words instead of the homeowner's (the staff page); the hidden field is left out then. */
  wording?: ContactWording;
  /** A schema with the same fields and staff messages (the staff page). */
  schema?: z.ZodType<z.output<typeof contactSchema>, z.input<typeof contactSchema>>;
};

function Field({ id, label, error, children, hint }: { id: string; label: string; error?: string; hint?: string; children: React.ReactNode }) {
  return (
    <div>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      {children}
      {hint && <p className="mt-1 text-xs text-slate">{hint}</p>}
      {error && (
        <p id={`${id}-error`} className="field-error">
          {error}
        </p>
      )}
    </div>
  );
}

/** Contact details, validated by the same schema as the API; server messages land on their fields. */
export function ContactStep({ firmName, sending, serverErrors, onSubmit, wording, schema = contactSchema }: Props) {
  const id = useId();
  const words: ContactWording = wording ?? {
    name: 'Your name',
    reach: `How should ${firmName} reach you?`,
    consent: `I agree that ${firmName} may contact me about this inquiry.`,
    submit: `Send to ${firmName}`,
    sending: 'Sending…',
  };
  const form = useForm<z.input<typeof contactSchema>, unknown, z.output<typeof contactSchema>>({
    resolver: zodResolver(schema),
    defaultValues: { name: '', email: '', phone: '', address: '', postcode: '', preferredContact: 'phone', message: '' },
  });
  const errors = form.formState.errors;
  const message = (name: keyof ContactInput) => errors[name]?.message ?? serverErrors[`contact.${name}`];
  const aria = (name: keyof ContactInput) => (message(name) ? { 'aria-invalid': true, 'aria-describedby': `${id}-${name}-error` } : {});

  return (
    <form
      noValidate
      className="space-y-4"
      onSubmit={form.handleSubmit((_, event) => {
        const honeypot = (event?.target as HTMLFormElement | undefined)?.elements.namedItem('website') as HTMLInputElement | null;
        // Send what the person typed; the server normalises it with the same schema.
        onSubmit(form.getValues() as ContactInput, honeypot?.value ?? '');
      })}
    >
      <Field id={`${id}-name`} label={words.name} error={message('name')}>
        <input id={`${id}-name`} className="field-input" autoComplete="name" {...aria('name')} {...form.register('name')} />
      </Field>
      <Field id={`${id}-email`} label="E-mail" error={message('email')}>
        <input id={`${id}-email`} type="email" className="field-input" autoComplete="email" {...aria('email')} {...form.register('email')} />
      </Field>
      <Field id={`${id}-phone`} label="Phone" error={message('phone')}>
        <input id={`${id}-phone`} type="tel" className="field-input" autoComplete="tel" {...aria('phone')} {...form.register('phone')} />
      </Field>
      <Field id={`${id}-address`} label="Street address" error={message('address')}>
        <input id={`${id}-address`} className="field-input" autoComplete="street-address" {...aria('address')} {...form.register('address')} />
      </Field>
      <Field id={`${id}-postcode`} label="ZIP or postcode" error={message('postcode')}>
        <input id={`${id}-postcode`} className="field-input max-w-[10rem]" autoComplete="postal-code" {...aria('postcode')} {...form.register('postcode')} />
      </Field>
      <fieldset>
        <legend className="field-label">{words.reach}</legend>
        <div className="mt-1 flex flex-wrap gap-3">
          {(['phone', 'text', 'email'] as const).map((method) => (
            <label key={method} className="flex items-center gap-2 text-sm">
              <input type="radio" value={method} className="h-5 w-5 accent-[var(--brand)]" {...form.register('preferredContact')} />
              {method === 'phone' ? 'Phone call' : method === 'text' ? 'Text message' : 'E-mail'}
            </label>
          ))}
        </div>
        {message('preferredContact') && <p className="field-error">{message('preferredContact')}</p>}
      </fieldset>
      <Field id={`${id}-message`} label="Anything else? (optional)" error={message('message')}>
        <textarea id={`${id}-message`} rows={3} className="field-input" {...aria('message')} {...form.register('message')} />
      </Field>
      {/* People never see this field; form-filling software does. */}
      {!wording && (
        <div aria-hidden="true" className="absolute -left-[9999px] h-px w-px overflow-hidden">
          <label htmlFor={`${id}-website`}>Website</label>
          <input id={`${id}-website`} name="website" tabIndex={-1} autoComplete="off" defaultValue="" />
        </div>
      )}
      <div>
        <label className="flex items-start gap-2 text-sm">
          <input type="checkbox" className="mt-0.5 h-5 w-5 accent-[var(--brand)]" {...aria('consent')} {...form.register('consent')} />
          <span>{words.consent}</span>
        </label>
        {message('consent') && (
          <p id={`${id}-consent-error`} className="field-error">
            {message('consent')}
          </p>
        )}
      </div>
      <button
        type="submit"
        className="w-full rounded-md bg-[var(--brand)] px-4 py-3 font-medium text-[var(--brand-text)] disabled:opacity-60"
        disabled={sending}
      >
        {sending ? words.sending : words.submit}
      </button>
    </form>
  );
}
