import { useId } from 'react';
import type { Units } from '~/lib/estimate/index.ts';
import { LengthField } from './LengthField';
import { TreatmentIcon } from './TreatmentIcon';
import { roomWalls, type Draft, type FieldErrors, type FinishDraft, type RoomDraft } from './draft';

export type OfferedTreatment = { id: string; name: string; kind: string; orientation?: 'vertical' | 'horizontal' };

type Props = {
  treatments: OfferedTreatment[];
  draft: Draft;
  errors: FieldErrors;
  onChange: (patch: Partial<Draft>) => void;
  units?: Units;
};

type FinishErrors = { treatment?: string | undefined; wainscotHeight?: string | undefined };

const HEIGHT_LABELS = { wainscot: 'Lower wall, finished with a cap rail', full: 'Full height, floor to ceiling' } as const;

/** Treatment cards, the height and the cap-rail height: one room's finish (or its accent wall's). */
function FinishFields({
  treatments,
  finish,
  onChange,
  errors,
  units,
  legend,
  compact = false,
}: {
  treatments: OfferedTreatment[];
  finish: FinishDraft;
  onChange: (finish: FinishDraft) => void;
  errors: FinishErrors;
  units: Units;
  legend: string;
  compact?: boolean;
}) {
  const id = useId();
  const set = (patch: Partial<FinishDraft>) => onChange({ ...finish, ...patch });
  return (
    <div className="space-y-4">
      <fieldset>
        <legend className={compact ? 'field-label' : 'text-base font-bold'}>{legend}</legend>
        {compact ? (
          <>
            <label htmlFor={`${id}-treatment`} className="sr-only">
              {legend}
            </label>
            <select
              id={`${id}-treatment`}
              className="field-input"
              value={finish.treatmentId ?? ''}
              aria-invalid={errors.treatment ? true : undefined}
              onChange={(event) => set({ treatmentId: event.target.value || null })}
            >
              <option value="">Choose a finish…</option>
              {treatments.map((t) => (
                <option key={t.id} value={t.id}>
                  {t.name}
                </option>
              ))}
            </select>
          </>
        ) : (
          <div className="mt-3 grid gap-3 sm:grid-cols-2">
            {treatments.map((t) => (
              <label
                key={t.id}
                className={`choice-card flex cursor-pointer items-center gap-3 rounded-lg border bg-white p-3 ${finish.treatmentId === t.id ? 'border-2 border-[var(--brand)] bg-sawdust/30' : 'border-slate/30'}`}
              >
                <input
                  type="radio"
                  name={`${id}-treatment`}
                  className="sr-only"
                  checked={finish.treatmentId === t.id}
                  onChange={() => set({ treatmentId: t.id })}
                />
                <TreatmentIcon kind={t.kind} orientation={t.orientation} />
                <span className="font-medium">{t.name}</span>
              </label>
            ))}
          </div>
        )}
        {errors.treatment && <p className="field-error">{errors.treatment}</p>}
      </fieldset>

      <fieldset>
        <legend className={compact ? 'field-label' : 'text-base font-bold'}>How high?</legend>
        <div className="mt-2 grid grid-cols-2 gap-2">
          {(['wainscot', 'full'] as const).map((height) => (
            <label
              key={height}
              className={`choice-card cursor-pointer rounded-md border px-3 py-3 text-sm ${finish.height === height ? 'border-2 border-[var(--brand)] bg-sawdust/30 font-medium' : 'border-slate/30 bg-white'}`}
            >
              <input type="radio" name={`${id}-height`} className="sr-only" checked={finish.height === height} onChange={() => set({ height })} />
              {HEIGHT_LABELS[height]}
            </label>
          ))}
        </div>
        {finish.height === 'wainscot' && (
          <div className="mt-3 max-w-xs">
            <LengthField
              label="Height to the top of the cap rail"
              value={finish.wainscotHeight}
              units={units}
              kind="wainscot-height"
              required
              onChange={(wainscotHeight) => set({ wainscotHeight })}
              error={errors.wainscotHeight}
              hint="About a third of the ceiling height is a common choice."
            />
          </div>
        )}
      </fieldset>
    </div>
  );
}

/**
 * A finish and a height per room. The first room's choice is every other room's until that room
 * picks its own; each room may have one accent wall in another finish.
 */
export function TreatmentStep({ treatments, draft, errors, onChange, units = 'imperial' }: Props) {
  const first: FinishDraft = { treatmentId: draft.treatmentId, height: draft.height, wainscotHeight: draft.wainscotHeight };
  const firstName = draft.rooms[0]?.name.trim() || 'Room 1';
  const updateRoom = (r: number, patch: Partial<RoomDraft>) => onChange({ rooms: draft.rooms.map((room, i) => (i === r ? { ...room, ...patch } : room)) });
  const several = draft.rooms.length > 1;
  return (
    <div className="space-y-6">
      {draft.rooms.map((room, r) => {
        const at = `project.rooms.${r}`;
        const name = room.name.trim() || `Room ${r + 1}`;
        const walls = roomWalls(room, units).filter((v) => v.covered);
        return (
          <section
            key={room.key}
            className={several ? 'space-y-4 rounded-lg border border-slate/30 bg-white p-4' : 'space-y-4'}
            aria-label={several ? name : undefined}
          >
            {several && <h3 className="text-lg font-bold">{name}</h3>}
            {r === 0 ? (
              <FinishFields
                treatments={treatments}
                finish={first}
                units={units}
                legend={several ? `What would you like on the walls of the ${name}?` : 'What would you like on the walls?'}
                errors={{ treatment: errors['project.treatment'], wainscotHeight: errors['project.wainscotHeight'] }}
                onChange={(finish) => onChange({ treatmentId: finish.treatmentId, height: finish.height, wainscotHeight: finish.wainscotHeight })}
              />
            ) : (
              <>
                <label className="flex items-center gap-2 text-sm">
                  <input
                    type="checkbox"
                    className="h-5 w-5 accent-[var(--brand)]"
                    checked={room.finish === null}
                    onChange={(event) => updateRoom(r, { finish: event.target.checked ? null : { ...first } })}
                  />
                  The same as the {firstName}
                </label>
                {room.finish && (
                  <FinishFields
                    treatments={treatments}
                    finish={room.finish}
                    units={units}
                    legend={`What would you like on the walls of the ${name}?`}
                    errors={{ treatment: errors[`${at}.finish.treatment`], wainscotHeight: errors[`${at}.finish.wainscotHeight`] }}
                    onChange={(finish) => updateRoom(r, { finish })}
                  />
                )}
              </>
            )}
            {walls.length > 1 && (
              <AccentWall
                room={room}
                walls={walls.map((v) => ({ index: v.index, name: v.name }))}
                treatments={treatments}
                units={units}
                base={room.finish ?? first}
                errors={errors}
                at={at}
                onChange={(accent) => updateRoom(r, { accent })}
              />
            )}
          </section>
        );
      })}
    </div>
  );
}

function AccentWall({
  room,
  walls,
  treatments,
  units,
  base,
  errors,
  at,
  onChange,
}: {
  room: RoomDraft;
  walls: { index: number; name: string }[];
  treatments: OfferedTreatment[];
  units: Units;
  base: FinishDraft;
  errors: FieldErrors;
  at: string;
  onChange: (accent: RoomDraft['accent']) => void;
}) {
  const id = useId();
  const accent = room.accent;
  return (
    <div className="space-y-3 rounded-md border border-slate/20 p-3">
      <label className="flex items-center gap-2 text-sm font-medium">
        <input
          type="checkbox"
          className="h-5 w-5 accent-[var(--brand)]"
          checked={accent !== null}
          onChange={(event) =>
            onChange(
              event.target.checked
                ? { wall: null, finish: { treatmentId: null, height: base.height === 'full' ? 'wainscot' : 'full', wainscotHeight: base.wainscotHeight } }
                : null,
            )
          }
        />
        One accent wall in a different finish or height
      </label>
      {accent && (
        <>
          <div>
            <label htmlFor={`${id}-wall`} className="field-label">
              Which wall?
            </label>
            <select
              id={`${id}-wall`}
              className="field-input"
              value={accent.wall ?? ''}
              aria-invalid={errors[`${at}.accent.wall`] ? true : undefined}
              onChange={(event) => onChange({ ...accent, wall: event.target.value === '' ? null : Number(event.target.value) })}
            >
              <option value="">Choose a wall…</option>
              {walls.map((w) => (
                <option key={w.index} value={w.index}>
                  {w.name}
                </option>
              ))}
            </select>
            {errors[`${at}.accent.wall`] && <p className="field-error">{errors[`${at}.accent.wall`]}</p>}
          </div>
          <FinishFields
            compact
            treatments={treatments}
            finish={accent.finish}
            units={units}
            legend="Finish on the accent wall"
            errors={{ treatment: errors[`${at}.accent.treatment`], wainscotHeight: errors[`${at}.accent.wainscotHeight`] }}
            onChange={(finish) => onChange({ ...accent, finish })}
          />
        </>
      )}
    </div>
  );
}
