/**
 * The Rate book editor's requests: the firm's versions and its draft, starting a draft from the
 * published version, and saving it with the revision it was loaded at. A save that finds another
 * revision stored (someone else saved in between) is refused with the stored draft and what changed.
 */
import type { RateBookInput } from '~/lib/estimate';
import { callJson, RequestFailed } from '~/components/inquiries/page/api';

export type RateVersionSummary = {
  id: string;
  number: number;
  status: 'published' | 'retired' | 'draft';
  note: string | null;
  publishedAt: string | null;
  publishedBy: string | null;
  createdAt: string;
};

export type RateDraft = {
  id: string;
  number: number;
  /** Counts saves; a save names the revision it started from. */
  revision: number;
  data: RateBookInput;
  updatedAt: string;
  updatedBy: string | null;
  basedOn: number | null;
};

export type RatesOverview = { published: RateVersionSummary | null; draft: RateDraft | null; versions: RateVersionSummary[] };

/** One field that differs between the draft as stored and the one being saved (values as stored; the label comes from the field catalogue when the server gives none). */
export type DraftChange = { path: string; label?: string; mine: unknown; theirs: unknown };

export class DraftConflict extends RequestFailed {
  constructor(
    message: string,
    /** The draft as it is stored now. */
    readonly draft: RateDraft,
    readonly changed: DraftChange[],
  ) {
    super(message, 409);
  }
}

export const DRAFT_URL = '/api/app/rates/draft';

/** The firm's draft: a copy of the published version, or the draft that already exists. */
export const startDraft = () => callJson<RateDraft>('POST', DRAFT_URL, {});

export function saveDraft(revision: number, data: RateBookInput): Promise<{ revision: number; updatedAt: string }> {
  return callJson('PUT', DRAFT_URL, { revision, data }, (message, status, body) =>
    status === 409 && body.draft
      ? new DraftConflict(message, body.draft as RateDraft, (body.changed as DraftChange[] | undefined) ?? [])
      : new RequestFailed(message, status, body.fields ?? {}),
  );
}

export const RATES_URL = '/api/app/rates';
export const PREVIEW_URL = '/api/app/rates/draft/preview';
export const REPLAY_URL = '/api/app/rates/draft/replay';

/** Makes the draft the published version; refused (409) when it was saved again since `revision`. */
export const publishDraft = (revision: number, note?: string) =>
  callJson<RateVersionSummary>('POST', `${DRAFT_URL}/publish`, note ? { revision, note } : { revision });

export const discardDraft = (revision: number) => callJson<null>('DELETE', DRAFT_URL, { revision });

/** A new draft copied from an older version (to go back to its numbers). */
export const startDraftFrom = (fromVersionId: string) => callJson<RateDraft>('POST', DRAFT_URL, { fromVersionId });

/** One project's price under one version, or why that version cannot price it. */
export type PricedSide = { ok: true; lowCents: number; highCents: number; middleCents: number; minimumApplied: boolean } | { ok: false; reason: string };

export type SamplePreview = {
  draft: { number: number; revision: number };
  published: { number: number } | null;
  rooms: { treatmentId: string; treatmentName: string; description: string; published: PricedSide | null; draft: PricedSide }[];
};

export type ReplaySummary = {
  inquiries: number;
  compared: number;
  up: number;
  down: number;
  same: number;
  refused: { reference: string; reason: string }[];
  totalChangeCents: number;
  medianChangeCents: number;
  medianChangePercent: number;
  intoMinimum: string[];
  outOfMinimum: string[];
  bands: { label: string; count: number }[];
  largest: { leadId: string; reference: string; publishedMiddleCents: number; draftMiddleCents: number; changeCents: number; changePercent: number }[];
};

export type Replay = {
  id: string;
  status: 'queued' | 'running' | 'done' | 'failed';
  done: number;
  total: number;
  draftRevision: number;
  summary: ReplaySummary | null;
  failure: string | null;
};

export const startReplay = () => callJson<Replay>('POST', REPLAY_URL);

export type VersionComparison = {
  before: RateVersionSummary;
  after: RateVersionSummary;
  changes: { path: string; before: unknown; after: unknown }[];
};

export const compareVersions = (before: string, after: string) =>
  callJson<VersionComparison>('GET', `${RATES_URL}/compare?${new URLSearchParams({ before, after })}`);
