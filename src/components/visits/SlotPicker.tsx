import { useId } from 'react';
import type { SlotView } from '~/lib/shared/visit-schemas';
import { clockTime, dateHeading, localDateAt } from './calendar-time';

type Props = {
  slots: SlotView[];
  timeZone: string;
  /** The chosen slot's key (`start|salespersonId`). */
  value: string | null;
  onChange: (slot: SlotView) => void;
  /** Names of people, when the slots are the whole team's. */
  names?: Record<string, string>;
  label: string;
  /** Days shown before "Show more days". */
  maxDays?: number;
};

export const slotKey = (slot: SlotView) => `${slot.start}|${slot.salespersonId ?? ''}`;

/** Open times grouped by day on the firm's clock, each a radio button. */
export function SlotPicker({ slots, timeZone, value, onChange, names, label, maxDays = 14 }: Props) {
  const id = useId();
  const days = new Map<string, SlotView[]>();
  for (const slot of slots) {
    const day = localDateAt(new Date(slot.start), timeZone);
    days.set(day, [...(days.get(day) ?? []), slot]);
  }
  if (slots.length === 0) return <p className="text-sm text-slate">No open times.</p>;
  return (
    <fieldset className="max-h-72 space-y-3 overflow-y-auto pr-1">
      <legend className="sr-only">{label}</legend>
      {[...days.entries()].slice(0, maxDays).map(([day, daySlots]) => (
        <div key={day} role="group" aria-labelledby={`${id}-${day}`}>
          <p id={`${id}-${day}`} className="text-sm font-medium">
            {dateHeading(day)}
          </p>
          <div className="mt-1 flex flex-wrap gap-1.5">
            {daySlots.map((slot) => {
              const key = slotKey(slot);
              const who = names && slot.salespersonId ? names[slot.salespersonId] : undefined;
              return (
                <label
                  key={key}
                  className="figures cursor-pointer rounded-md border border-slate/40 bg-white px-2 py-1 text-sm has-[:checked]:border-lapwing has-[:checked]:bg-lapwing has-[:checked]:text-white has-[:focus-visible]:outline has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-ink"
                >
                  <input type="radio" name={`${id}-slot`} className="sr-only" checked={value === key} onChange={() => onChange(slot)} />
                  {clockTime(slot.start, timeZone)}
                  {who ? ` · ${who}` : ''}
                </label>
              );
            })}
          </div>
        </div>
      ))}
    </fieldset>
  );
}
