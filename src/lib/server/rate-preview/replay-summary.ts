/**
 * What a draft would do to recent inquiries, summed up from each inquiry's price under the published
 * version and under the draft (both worked out now, from the same stored project, so the difference
 * is the draft's alone). Pure: the replay job and the inline replay both feed it.
 */
import type { PricedSide } from './priced-pair';

export type ReplayedInquiry = { leadId: string; reference: string; published: PricedSide; draft: PricedSide };

/** Bands of the change in the middle of the range, in per cent, for the chart. */
export const CHANGE_BANDS = [
  { label: '−20 % or more', from: -Infinity, to: -20 },
  { label: '−20 to −5 %', from: -20, to: -5 },
  { label: '−5 to 0 %', from: -5, to: 0 },
  { label: 'No change', from: 0, to: 0 },
  { label: '0 to +5 %', from: 0, to: 5 },
  { label: '+5 to +20 %', from: 5, to: 20 },
  { label: '+20 % or more', from: 20, to: Infinity },
] as const;

export type ReplaySummary = {
  inquiries: number;
  /** Priced by both versions. */
  compared: number;
  up: number;
  down: number;
  same: number;
  /** Inquiries the draft (or the published version) cannot price: a finish or zone no longer offered. */
  refused: { reference: string; reason: string }[];
  /** Sum and median of the change in the middle of each range, in cents. */
  totalChangeCents: number;
  medianChangeCents: number;
  medianChangePercent: number;
  /** Inquiries that the minimum job would newly hold up, or newly let go. */
  intoMinimum: string[];
  outOfMinimum: string[];
  bands: { label: string; count: number }[];
  /** The largest moves, for the table. */
  largest: { leadId: string; reference: string; publishedMiddleCents: number; draftMiddleCents: number; changeCents: number; changePercent: number }[];
};

const median = (sorted: number[]): number =>
  sorted.length === 0 ? 0 : sorted.length % 2 ? sorted[(sorted.length - 1) / 2] : (sorted[sorted.length / 2 - 1] + sorted[sorted.length / 2]) / 2;

function bandOf(percent: number): number {
  if (percent === 0) return 3;
  if (percent < 0) return percent <= -20 ? 0 : percent <= -5 ? 1 : 2;
  return percent >= 20 ? 6 : percent >= 5 ? 5 : 4;
}

export function summariseReplay(rows: ReplayedInquiry[], largestCount = 20): ReplaySummary {
  const changes: ReplaySummary['largest'] = [];
  const refused: ReplaySummary['refused'] = [];
  const intoMinimum: string[] = [];
  const outOfMinimum: string[] = [];
  for (const row of rows) {
    const { published, draft } = row;
    if (!published.ok || !draft.ok) {
      refused.push({ reference: row.reference, reason: !draft.ok ? `Draft: ${draft.reason}` : `Published: ${(published as { reason: string }).reason}` });
      continue;
    }
    const changeCents = draft.middleCents - published.middleCents;
    const changePercent = published.middleCents === 0 ? 0 : (changeCents / published.middleCents) * 100;
    changes.push({
      leadId: row.leadId,
      reference: row.reference,
      publishedMiddleCents: published.middleCents,
      draftMiddleCents: draft.middleCents,
      changeCents,
      changePercent,
    });
    if (draft.minimumApplied && !published.minimumApplied) intoMinimum.push(row.reference);
    if (!draft.minimumApplied && published.minimumApplied) outOfMinimum.push(row.reference);
  }
  const bands = CHANGE_BANDS.map((b) => ({ label: b.label, count: 0 }));
  for (const c of changes) bands[bandOf(c.changePercent)].count++;
  const byCents = changes.map((c) => c.changeCents).sort((a, b) => a - b);
  const byPercent = changes.map((c) => c.changePercent).sort((a, b) => a - b);
  return {
    inquiries: rows.length,
    compared: changes.length,
    up: changes.filter((c) => c.changeCents > 0).length,
    down: changes.filter((c) => c.changeCents < 0).length,
    same: changes.filter((c) => c.changeCents === 0).length,
    refused,
    totalChangeCents: byCents.reduce((sum, c) => sum + c, 0),
    medianChangeCents: Math.round(median(byCents)),
    medianChangePercent: Math.round(median(byPercent) * 10) / 10,
    intoMinimum,
    outOfMinimum,
    bands,
    largest: [...changes].sort((a, b) => Math.abs(b.changeCents) - Math.abs(a.changeCents)).slice(0, largestCount),
  };
}
