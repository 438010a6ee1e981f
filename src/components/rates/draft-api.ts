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
