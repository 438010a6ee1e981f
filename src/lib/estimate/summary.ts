/** Plain-language text for a wall: the drawing's text alternative and a line for the lead file. */
import type { WallTakeoff } from './types.ts';
import { formatArea, formatLength, type Units } from './units.ts';

const n = (count: number, one: string, many = `${one}s`): string => `${count} ${count === 1 ? one : many}`;

/** One or two sentences that say what the wall drawing shows, in the firm's units. */
export function wallSummary(wall: WallTakeoff, units: Units, treatmentName?: string): string {
  const len = (x: number): string => formatLength(x, units);
  const parts: string[] = [
    `${wall.label}: ${len(wall.length)} long, ceiling ${len(wall.ceilingHeight)}.`,
    `${treatmentName ?? 'New finish'} from ${len(wall.bandBottom)} to ${len(wall.bandTop)} above the floor, ${formatArea(wall.netSqFt, units)} after openings.`,
  ];
  if (wall.boards) {
    const b = wall.boards;
    const ripped = b.lastWidth < b.boardWidth - 1e-6 ? `, the last ripped to ${len(b.lastWidth)}` : '';
    parts.push(`${n(b.count, `${b.orientation} board`)} ${len(b.boardWidth)} wide with ${len(b.gap)} gaps${ripped}.`);
  }
  if (wall.frames && wall.frames.count > 0) parts.push(`${n(wall.frames.count, 'frame')} about ${len(wall.frames.width)} × ${len(wall.frames.height)}.`);
  const battens = wall.pieces.filter((p) => p.role === 'batten' || p.role === 'stile').length;
  if (battens > 0) parts.push(`${n(battens, 'batten or stile piece', 'batten and stile pieces')}.`);
  const doors = wall.openings.filter((o) => o.kind === 'door');
  const windows = wall.openings.filter((o) => o.kind === 'window');
  if (doors.length) parts.push(`${n(doors.length, 'door')} (${doors.map((o) => `${len(o.width)} × ${len(o.height)}`).join(', ')}).`);
  if (windows.length)
    parts.push(`${n(windows.length, 'window')} (${windows.map((o) => `${len(o.width)} × ${len(o.height)}, sill ${len(o.sillHeight)}`).join('; ')}).`);
  const outlets = wall.boxes.filter((b) => b.kind === 'outlet').length;
  const switches = wall.boxes.filter((b) => b.kind === 'switch').length;
  if (outlets + switches > 0) {
    parts.push(`${n(outlets, 'outlet')} and ${n(switches, 'switch', 'switches')}; ${n(wall.cutOuts, 'cut-out')} in the new finish.`);
  }
  if (wall.capRailFeet > 0) parts.push(`Cap rail on top.`);
  return parts.join(' ');
}
