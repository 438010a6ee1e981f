import { useEffect, useId, useRef, useState } from 'react';
import type { Units } from '~/lib/estimate/index.ts';
import { LengthField } from './LengthField';
import { isDamp, newWall, newRoom, offersFixtures, placeForMe, roomWalls, wallFitErrors, type FieldErrors, type RoomDraft, type WallDraft } from './draft';
import { WallItemsEditor } from './WallItemsEditor';

const ROOM_NAMES = ['Living room', 'Dining room', 'Bedroom', 'Hallway', 'Entry', 'Bathroom', 'Kitchen', 'Office', 'Stairway', 'Laundry'];
/** How long "Undo" stays after a room is removed. */
const UNDO_MS = 10_000;

type Props = {
  rooms: RoomDraft[];
  units: Units;
  errors: FieldErrors;
  onChange: (rooms: RoomDraft[]) => void;
};

export function RoomsStep({ rooms, units, errors, onChange }: Props) {
  // DOM ids come from useId (stable between server and browser), not from the draft's keys.
  const baseId = useId();
  const [removed, setRemoved] = useState<{ room: RoomDraft; index: number } | null>(null);
  const undoTimer = useRef<ReturnType<typeof setTimeout> | undefined>(undefined);
  useEffect(() => () => clearTimeout(undoTimer.current), []);
  const update = (index: number, patch: Partial<RoomDraft>) => onChange(rooms.map((room, i) => (i === index ? { ...room, ...patch } : room)));
  const remove = (index: number) => {
    setRemoved({ room: rooms[index]!, index });
    clearTimeout(undoTimer.current);
    undoTimer.current = setTimeout(() => setRemoved(null), UNDO_MS);
    onChange(rooms.filter((_, i) => i !== index));
  };
  const undo = () => {
    if (!removed) return;
    onChange([...rooms.slice(0, removed.index), removed.room, ...rooms.slice(removed.index)]);
    setRemoved(null);
  };
  const hint = units === 'imperial' ? 'Type it as your tape reads: 11\' 4", 136 or 11 ft 4 in.' : 'In mm, cm or m: 3450 mm, 345 cm, 3.45 m.';
  return (
    <div className="space-y-6">
      {rooms.map((room, r) => {
        const at = `project.rooms.${r}`;
        const domId = `${baseId}-room${r}`;
        // Fit messages show as soon as they are true, next to their wall.
        const shown = { ...errors, ...wallFitErrors(room, r, units) };
        const views = roomWalls(room, units);
        const setWall = (index: number, patch: Partial<WallDraft>) => {
          if (room.mode === 'room') {
            const roomWalls = room.roomWalls.map((w, i) => (i === index ? { ...w, ...patch } : w)) as RoomDraft['roomWalls'];
            update(r, { roomWalls });
          } else update(r, { walls: room.walls.map((w, i) => (i === index ? { ...w, ...patch } : w)) });
        };
        const withFixtures = offersFixtures(room);
        const placed = room.placement === 'auto' ? placeForMe(room, units) : null;
        const label = room.name.trim() || `Room ${r + 1}`;
        // "in the Bathroom", but "in room 1" for a room not named yet.
        const inRoom = room.name.trim() ? `in the ${room.name.trim()}` : `in room ${r + 1}`;
        return (
          <fieldset key={room.key} className="space-y-4 rounded-lg border border-slate/30 bg-white p-4" data-testid={`room-${r}`}>
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
                placeholder="e.g. Living room"
                maxLength={60}
                onChange={(event) => update(r, { name: event.target.value })}
              />
              <datalist id={`${domId}-names`}>
                {ROOM_NAMES.map((name) => (
                  <option key={name} value={name} />
                ))}
              </datalist>
              {errors[`${at}.name`] && <p className="field-error">{errors[`${at}.name`]}</p>}
              <label className="mt-2 flex items-center gap-2 text-sm">
                <input
                  type="checkbox"
                  className="h-5 w-5 accent-[var(--brand)]"
                  checked={isDamp(room)}
                  onChange={(event) => update(r, { damp: event.target.checked })}
                />
                This room gets damp (bathroom, laundry, shower room)
              </label>
              <label className="mt-1 flex items-center gap-2 text-sm">
                <input
                  type="checkbox"
                  className="h-5 w-5 accent-[var(--brand)]"
                  checked={withFixtures}
                  onChange={(event) => update(r, { hasFixtures: event.target.checked })}
                />
                It has a tub, shower, vanity, toilet, radiator or built-in cabinet against a wall
              </label>
            </div>

            <CardChoices
              label="How would you like to give the sizes?"
              name={`${domId}-mode`}
              options={[
                ['room', 'Room length × width'],
                ['walls', 'Wall by wall'],
              ]}
              value={room.mode}
              onChange={(mode) => update(r, { mode, accent: null })}
            />

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
                  <p className="text-xs text-slate">Clockwise, starting from a wall along the room's length.</p>
                  <div className="mt-1 grid grid-cols-2 gap-2">
                    {views.map((v) => (
                      <label key={v.wall.key} className="flex items-center gap-2 text-sm">
                        <input
                          type="checkbox"
                          className="h-5 w-5 accent-[var(--brand)]"
                          checked={v.covered}
                          onChange={(event) => setWall(v.index, { covered: event.target.checked })}
                        />
                        {v.name}
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
                        onChange={(length) => setWall(w, { length })}
                        error={errors[`${at}.walls.${w}.length`]}
                      />
                    </div>
                    {room.walls.length > 1 && (
                      <button
                        type="button"
                        className="button-quiet mb-0.5 px-3"
                        aria-label={`Remove wall ${w + 1}`}
                        onClick={() => update(r, { walls: room.walls.filter((_, i) => i !== w), accent: null })}
                      >
                        Remove
                      </button>
                    )}
                  </div>
                ))}
                {room.walls.length < 16 && (
                  <button type="button" className="button-quiet" onClick={() => update(r, { walls: [...room.walls, newWall()] })}>
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

            <fieldset className="space-y-3">
              <legend className="field-label">Doors, windows and outlets{withFixtures ? ', fixtures' : ''}</legend>
              <CardChoices
                label={`Where are they ${inRoom}?`}
                name={`${domId}-placement`}
                options={[
                  ['auto', 'Count them; place them for me'],
                  ['by-wall', "I'll say which wall"],
                ]}
                value={room.placement}
                onChange={(placement) => update(r, { placement })}
              />
              {placed ? (
                <>
                  <WallItemsEditor items={room.counts} withFixtures={withFixtures} where={inRoom} onChange={(counts) => update(r, { counts })} />
                  {placed.notes.length > 0 && (
                    <p className="text-sm text-slate" role="status" data-testid="placed-note">
                      Placed where they fit: {placed.notes.join('; ')}.
                    </p>
                  )}
                  {/* The server's word on a wall we placed things on (its casing may be wider than the usual one). */}
                  {views.flatMap((v) =>
                    Object.entries(shown)
                      .filter(([path]) => path.startsWith(`${at}.walls.${v.index}.`) && !path.endsWith('.length'))
                      .map(([path, message]) => (
                        <p key={path} className="field-error" role="alert">
                          {v.name}: {message}
                        </p>
                      )),
                  )}
                  {(shown[`${at}.placement`] || placed.unplaced.length > 0) && (
                    <p className="field-error" role="alert">
                      {shown[`${at}.placement`] ??
                        `We could not find a wall with room for ${placed.unplaced.join(', ')}. Choose the walls yourself, or check the sizes and the walls to cover.`}
                    </p>
                  )}
                </>
              ) : (
                views
                  .filter((v) => v.covered)
                  .map((v) => {
                    const wallAt = `${at}.walls.${v.index}`;
                    const messages = Object.entries(shown).filter(([path]) => path.startsWith(`${wallAt}.`) && !path.endsWith('.length'));
                    return (
                      <div
                        key={v.wall.key}
                        role="group"
                        aria-label={v.name}
                        data-testid={`wall-${r}-${v.index}`}
                        className={`space-y-2 rounded-md border p-2 ${messages.length ? 'border-brick' : 'border-slate/20'}`}
                      >
                        <p className="text-sm font-bold">{v.name}</p>
                        <WallItemsEditor
                          compact
                          items={v.wall}
                          withFixtures={withFixtures}
                          where={`on ${v.name}`}
                          onChange={(items) => setWall(v.index, items)}
                        />
                        {messages.map(([path, message]) => (
                          <p key={path} className="field-error" role="alert">
                            {message}
                          </p>
                        ))}
                      </div>
                    );
                  })
              )}
            </fieldset>

            {rooms.length > 1 && (
              <button type="button" className="text-sm text-brick underline" onClick={() => remove(r)}>
                Remove {label}
              </button>
            )}
          </fieldset>
        );
      })}
      {removed && (
        <p role="status" className="flex items-center justify-between gap-3 rounded-md border border-slate/30 bg-sawdust/30 px-3 py-2 text-sm">
          <span>{removed.room.name.trim() || `Room ${removed.index + 1}`} removed.</span>
          <button type="button" className="button-quiet px-3 py-1" onClick={undo}>
            Undo
          </button>
        </p>
      )}
      {/* About the project as a whole, e.g. too big for one online estimate. */}
      {errors['project.rooms'] && (
        <p className="field-error" role="alert">
          {errors['project.rooms']}
        </p>
      )}
      {rooms.length < 20 && (
        <button type="button" className="button-quiet w-full" onClick={() => onChange([...rooms, newRoom(units)])}>
          Add another room
        </button>
      )}
    </div>
  );
}

/** Card-style radio choices side by side (the radio hidden, its focus shown on the card). */
function CardChoices<T extends string>({
  label,
  name,
  options,
  value,
  onChange,
}: {
  label: string;
  name: string;
  options: ReadonlyArray<readonly [T, string]>;
  value: T;
  onChange: (value: T) => void;
}) {
  return (
    <div role="radiogroup" aria-label={label} className="grid grid-cols-2 gap-2">
      {options.map(([option, text]) => (
        <label
          key={option}
          className={`choice-card cursor-pointer rounded-md border px-3 py-2 text-sm ${value === option ? 'border-[var(--brand)] bg-sawdust/40 font-medium' : 'border-slate/30'}`}
        >
          <input type="radio" className="sr-only" name={name} checked={value === option} onChange={() => onChange(option)} />
          {text}
        </label>
      ))}
    </div>
  );
}
