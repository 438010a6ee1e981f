/**
 * What each of the owner's reports holds, as plain data: the server fills it, the page's tables and
 * the CSV files write it, and the chart islands draw it. Weeks are named by their Monday
 * (`YYYY-MM-DD` on the firm's clock). Safe for islands and the server alike.
 */
import { LEAD_SOURCES, type LeadSource } from './labels';

/** The widget funnel's steps, in order, with the words people see. */
export const FUNNEL_COLUMNS = [
  { key: 'opened', label: 'Widget opened' },
  { key: 'rangeShown', label: 'Range shown' },
  { key: 'inquirySent', label: 'Inquiry sent' },
  { key: 'visitBooked', label: 'Visit booked' },
  { key: 'goingAhead', label: 'Going ahead' },
] as const;
export type FunnelKey = (typeof FUNNEL_COLUMNS)[number]['key'];

export type FunnelWeek = { week: string } & Record<FunnelKey, number>;
export type FunnelReport = { weeks: FunnelWeek[]; total: Record<FunnelKey, number> };

export type ResponseFigures = {
  /** Inquiries received. */
  received: number;
  /** Of those, answered (a first contact logged). */
  answered: number;
  /** Working minutes to the first contact, over the answered ones. */
  medianMinutes: number | null;
  p90Minutes: number | null;
  /** Answered, or still unanswered past their due time: the ones whose verdict is in. */
  decided: number;
  /** Answered by their due time. */
  withinTarget: number;
};
export type ResponseReport = { weeks: ({ week: string } & ResponseFigures)[]; total: ResponseFigures; targetMinutes: number };

export type FinishValue = { finish: string; jobs: number; valueCents: number };
export type FinishValueReport = { finishes: FinishValue[]; jobs: number; valueCents: number };

export type SourceWeek = { week: string; counts: Record<LeadSource, number>; total: number };
export type SourceReport = { weeks: SourceWeek[]; total: Record<LeadSource, number> & { all: number } };

export const REPORT_SOURCES = LEAD_SOURCES;

/** `part` as a share of `whole`, in per cent; null when there is nothing to share (no division by zero). */
export function percentOf(part: number, whole: number): number | null {
  return whole > 0 ? (part / whole) * 100 : null;
}
