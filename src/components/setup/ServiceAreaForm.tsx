import '~/lib/shared/zod-in-browser';
import { useEffect, useId, useState } from 'react';
import { fieldsFromZod } from '~/lib/estimate/errors.ts';
import { MAX_SERVICE_RADIUS_MILES, serviceAreaSchema, type ServiceArea } from '~/lib/shared/setup-schemas';
import { asRequestFailed, sendJson, type FormStatus } from '~/components/inquiries/page/api';
import { StatusLine } from '~/components/inquiries/page/StatusLine';

type Props = { initial: ServiceArea; officePostcode: string | null };

/** Split a typed list on commas, spaces and new lines. */
const codesOf = (text: string) => text.split(/[\s,;]+/).filter((code) => code !== '');

/**
 * Where the firm works (Setup → Service area): a list of postcodes or their first characters, or a
 * distance from the office's ZIP code. Checked by the shared schema, then by the route (which
 * also checks that the office's ZIP code can be placed).
 */
export function ServiceAreaForm({ initial, officePostcode }: Props) {
  const ids = useId();
  const [kind, setKind] = useState<ServiceArea['kind']>(initial.kind);
  const [codes, setCodes] = useState(initial.kind === 'postcodes' ? initial.postcodes.join(', ') : '');
  const [miles, setMiles] = useState(initial.kind === 'radius' ? String(initial.radiusMiles) : '25');
  const [fields, setFields] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<FormStatus>(null);
  const [saving, setSaving] = useState(false);
  const [ready, setReady] = useState(false);
  useEffect(() => setReady(true), []);

  async function save(event: { preventDefault(): void }) {
    event.preventDefault();
    setStatus(null);
    const body = kind === 'postcodes' ? { kind, postcodes: codesOf(codes) } : { kind, radiusMiles: miles.trim() === '' ? NaN : Number(miles) };
    const checked = serviceAreaSchema.safeParse(body);
    if (!checked.success) {
      setFields(fieldsFromZod(checked.error));
      setStatus({ kind: 'failed', text: 'Some fields need attention.' });
      return;
    }
    setSaving(true);
    try {
      const saved = await sendJson<ServiceArea>('PUT', '/api/app/settings/service-area', checked.data);
      if (saved.kind === 'postcodes') setCodes(saved.postcodes.join(', '));
      setFields({});
      setStatus({ kind: 'done', text: 'Saved. New inquiries are checked against this area.' });
    } catch (error) {
      const failed = asRequestFailed(error);
      setFields(failed.fields);
      setStatus({ kind: 'failed', text: failed.message });
    } finally {
      setSaving(false);
    }
  }

  // The first message about the list names its entry (postcodes.N → "Entry N+1: …").
  const listError = Object.entries(fields).find(([path]) => path.startsWith('postcodes'));
  const listMessage =
    listError && (listError[0] === 'postcodes' ? listError[1] : `“${codesOf(codes)[Number(listError[0].split('.')[1])] ?? ''}”: ${listError[1]}`);

  return (
    <form onSubmit={save} noValidate className="mt-4 max-w-lg space-y-4" data-ready={ready ? 'true' : undefined}>
      <fieldset className="space-y-3">
        <legend className="field-label">The area you work in</legend>
        <div className="flex items-start gap-2">
          <input id={`${ids}-list`} type="radio" name="kind" className="mt-1" checked={kind === 'postcodes'} onChange={() => setKind('postcodes')} />
          <label htmlFor={`${ids}-list`}>A list of ZIP codes or their first digits</label>
        </div>
        <div className="flex items-start gap-2">
          <input id={`${ids}-radius`} type="radio" name="kind" className="mt-1" checked={kind === 'radius'} onChange={() => setKind('radius')} />
          <label htmlFor={`${ids}-radius`}>
            A distance from your office
            <span className="block text-xs text-slate">
              {officePostcode ? `Measured from ZIP code ${officePostcode}, centre to centre.` : 'Add your office’s ZIP code to the firm profile first.'}
            </span>
          </label>
        </div>
      </fieldset>

      {kind === 'postcodes' ? (
        <div>
          <label htmlFor={`${ids}-codes`} className="field-label">
            ZIP codes
          </label>
          <textarea
            id={`${ids}-codes`}
            rows={3}
            className="field-input figures"
            value={codes}
            aria-invalid={listMessage ? true : undefined}
            aria-describedby={listMessage ? `${ids}-codes-error` : `${ids}-codes-hint`}
            onChange={(event) => setCodes(event.target.value)}
          />
          {listMessage ? (
            <p id={`${ids}-codes-error`} className="field-error">
              {listMessage}
            </p>
          ) : (
            <p id={`${ids}-codes-hint`} className="mt-1 text-xs text-slate">
              Separate them with commas. “787” covers every ZIP code starting 787. Leave it empty to take inquiries from anywhere.
            </p>
          )}
        </div>
      ) : (
        <div>
          <label htmlFor={`${ids}-miles`} className="field-label">
            Distance <span className="font-normal text-slate">(miles)</span>
          </label>
          <input
            id={`${ids}-miles`}
            type="number"
            inputMode="numeric"
            min={1}
            max={MAX_SERVICE_RADIUS_MILES}
            className="field-input figures max-w-32"
            value={miles}
            aria-invalid={fields.radiusMiles ? true : undefined}
            aria-describedby={fields.radiusMiles ? `${ids}-miles-error` : undefined}
            onChange={(event) => setMiles(event.target.value)}
          />
          {fields.radiusMiles && (
            <p id={`${ids}-miles-error`} className="field-error">
              {fields.radiusMiles}
            </p>
          )}
          <p className="mt-1 text-xs text-slate">A ZIP code we cannot place on the map counts as outside the area.</p>
        </div>
      )}
      {fields.kind && <p className="field-error">{fields.kind}</p>}

      <div className="flex items-center gap-3">
        <button type="submit" className="button-primary" disabled={saving}>
          {saving ? 'Saving…' : 'Save service area'}
        </button>
        <StatusLine status={status} />
      </div>
    </form>
  );
}
