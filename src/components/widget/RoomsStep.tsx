import { useId } from 'react';
import type { Units } from '~/lib/estimate/index.ts';
import { Counter } from './Counter';
import { LengthField } from './LengthField';
import { newKey, newRoom, type FieldErrors, type RoomDraft } from './draft';

const ROOM_NAMES = ['Living room', 'Dining room', 'Bedroom', 'Hallway', 'Entry', 'Bathroom', 'Kitchen', 'Office', 'Stairway', 'Laundry'];
const WALL_NAMES = ['First long wall', 'First short wall', 'Second long wall', 'Second short wall'];

type Props = {
  rooms: RoomDraft[];
  units: Units;
  errors: FieldErrors;
  onChange: (rooms: RoomDraft[]) => void;
};

export function RoomsStep({ rooms, units, errors, onChange }: Props) {
  // DOM ids come from useId (stable between server and browser), not from the draft's keys.
  const baseId = useId();
  const update = (index: number, patch: Partial<RoomDraft>) => onChange(rooms.map((room, i) => (i === index ? { ...room, ...patch } : room)));
  const hint = units === 'imperial' ? 'Type it as your tape reads: 11\' 4", 136 or 11 ft 4 in.' : 'In mm, cm or m: 3450 mm, 345 cm, 3.45 m.';
  return (
    <div className="space-y-6">
      {rooms.map((room, r) => {
        const at = `project.rooms.${r}`;
        const domId = `${baseId}-room${r}`;
        return (
          <fieldset key={room.key} className="space-y-4 rounded-lg border border-slate/30 bg-white p-4">
            <legend className="px-1 text-base font-bold">Room {r + 1}</legend>
            <div>
              <label className="field-label" htmlFor={`${domId}-name`}>
                Which room?
              </label>
              <input
                id={`${domId}-name`}
                className="field-input"
                list={`${domId}-names`}
                value={room.name}
                maxLength={60}
                onChange={(event) => update(r, { name: event.target.value })}
              />
              <datalist id={`${domId}-names`}>
                {ROOM_NAMES.map((name) => (
                  <option key={name} value={name} />
                ))}
              </datalist>
              {errors[`${at}.name`] && <p className="field-error">{errors[`${at}.name`]}</p>}
            </div>

            <div role="radiogroup" aria-label="How would you like to give the sizes?" className="grid grid-cols-2 gap-2">
              {(['room', 'walls'] as const).map((mode) => (
                <label
                  key={mode}
                  className={`choice-card cursor-pointer rounded-md border px-3 py-2 text-sm ${room.mode === mode ? 'border-[var(--brand)] bg-sawdust/40 font-medium' : 'border-slate/30'}`}
                >
                  <input type="radio" className="sr-only" name={`${domId}-mode`} checked={room.mode === mode} onChange={() => update(r, { mode })} />
                  {mode === 'room' ? 'Room length × width' : 'Wall by wall'}
                </label>
              ))}
            </div>

            {room.mode === 'room' ? (
              <>
                <div className="grid grid-cols-2 gap-3">
                  <LengthField
                    label="Room length"
                    units={units}
                    kind="room-length"
                    required
                    value={room.length}
                    onChange={(length) => update(r, { length })}
                    error={errors[`${at}.length`]}
                  />
                  <LengthField
                    label="Room width"
                    units={units}
                    kind="room-width"
                    required
                    value={room.width}
                    onChange={(width) => update(r, { width })}
                    error={errors[`${at}.width`]}
                  />
                </div>
                <fieldset>
                  <legend className="field-label">Walls to cover</legend>
                  <div className="mt-1 grid grid-cols-2 gap-2">
                    {WALL_NAMES.map((name, w) => (
                      <label key={name} className="flex items-center gap-2 text-sm">
                        <input
                          type="checkbox"
                          className="h-5 w-5 accent-[var(--brand)]"
                          checked={room.coverWalls[w]}
                          onChange={(event) => {
                            const coverWalls = [...room.coverWalls] as RoomDraft['coverWalls'];
                            coverWalls[w] = event.target.checked;
                            update(r, { coverWalls });
                          }}
                        />
                        {name}
                      </label>
                    ))}
                  </div>
                  {errors[`${at}.walls`] && <p className="field-error">{errors[`${at}.walls`]}</p>}
                </fieldset>
              </>
            ) : (
              <div className="space-y-3">
                {room.walls.map((wall, w) => (
                  <div key={wall.key} className="flex items-end gap-2">
                    <div className="flex-1">
                      <LengthField
                        label={`Wall ${w + 1} length`}
                        units={units}
                        kind="wall-length"
                        required
                        value={wall.length}
                        onChange={(length) => update(r, { walls: room.walls.map((x, i) => (i === w ? { ...x, length } : x)) })}
                        error={errors[`${at}.walls.${w}.length`]}
                      />
                    </div>
                    {room.walls.length > 1 && (
                      <button
                        type="button"
                        className="button-quiet mb-0.5 px-3"
                        aria-label={`Remove wall ${w + 1}`}
                        onClick={() => update(r, { walls: room.walls.filter((_, i) => i !== w) })}
                      >
                        Remove
                      </button>
                    )}
                  </div>
                ))}
                {room.walls.length < 16 && (
                  <button type="button" className="button-quiet" onClick={() => update(r, { walls: [...room.walls, { key: newKey(), length: '' }] })}>
                    Add a wall
                  </button>
                )}
              </div>
            )}
            <p className="text-xs text-slate">{hint}</p>

            <LengthField
              label="Ceiling height"
              units={units}
              kind="ceiling-height"
              required
              value={room.ceilingHeight}
              onChange={(ceilingHeight) => update(r, { ceilingHeight })}
              error={errors[`${at}.ceilingHeight`]}
            />

            <div className="grid gap-2 sm:grid-cols-2">
              <Counter label="Doors" value={room.doors} onChange={(doors) => update(r, { doors })} />
              <Counter label="Windows" value={room.windows} onChange={(windows) => update(r, { windows })} />
              <Counter label="Outlets" value={room.outlets} onChange={(outlets) => update(r, { outlets })} max={40} />
              <Counter label="Light switches" value={room.switches} onChange={(switches) => update(r, { switches })} max={40} />
            </div>
            {Object.entries(errors)
              .filter(([path]) => path.startsWith(`${at}.walls.`) && !path.endsWith('.length'))
              .map(([path, message]) => (
                <p key={path} className="field-error">
                  {message}
                </p>
              ))}

            {rooms.length > 1 && (
              <button type="button" className="text-sm text-brick underline" onClick={() => onChange(rooms.filter((_, i) => i !== r))}>
                Remove {room.name || `room ${r + 1}`}
              </button>
            )}
          </fieldset>
        );
      })}
      {/* About the project as a whole, e.g. too big for one online estimate. */}
      {errors['project.rooms'] && (
        <p className="field-error" role="alert">
          {errors['project.rooms']}
        </p>
      )}
      {rooms.length < 20 && (
        <button
          type="button"
          className="button-quiet w-full"
          onClick={() => onChange([...rooms, newRoom(units, ROOM_NAMES[rooms.length % ROOM_NAMES.length])])}
        >
          Add another room
        </button>
      )}
    </div>
  );
}
