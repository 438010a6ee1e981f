/**
 * What the report charts share: the workshop palette (tailwind.config.mjs) for their series, the
 * size they are drawn at, and week names as the tables write them.
 */
import { formatInZone } from '~/lib/shared/time';

/** Series colours, most important first: lapwing green, ink, slate, a darker wood, brick. */
export const SERIES_COLOURS = ['#2F6B4F', '#1F2A2E', '#5B6B73', '#A27B4A', '#B4442E'] as const;
export const CHART_HEIGHT = 260;
export const AXIS_TICK = { fill: '#5B6B73', fontSize: 12 } as const;

/** `2026-11-30` → `Nov 30`: a calendar day, so read at noon UTC where no zone can move it. */
export function weekName(day: string): string {
  return formatInZone(`${day}T12:00:00Z`, 'UTC', 'day');
}
