/**
 * The Inquiries list's vocabulary, shared by the list island and its staff routes: the columns,
 * the filters and how a view is written in a query string (the same string in the address bar,
 * in the API call and in the inquiry page's `?in=` link, so a view can be bookmarked and shared).
 */
import { z } from 'zod';
import { idSchema } from './ids';
import { LEAD_STAGE_IDS, type LeadStage } from './labels';

/** The list's columns, in their default order, with their headings. Every one sorts. */
export const INQUIRY_COLUMNS = [
  { id: 'reference', label: 'Reference' },
  { id: 'name', label: 'Homeowner' },
  { id: 'place', label: 'Town / postcode' },
  { id: 'finish', label: 'Finish' },
  { id: 'area', label: 'Covered area' },
  { id: 'range', label: 'Range' },
  { id: 'stage', label: 'Stage' },
  { id: 'assignee', label: 'Assigned to' },
  { id: 'received', label: 'Received' },
  { id: 'waiting', label: 'Waiting' },
  { id: 'followUp', label: 'Next follow-up' },
  { id: 'score', label: 'Triage score' },
] as const;

export type InquiryColumn = (typeof INQUIRY_COLUMNS)[number]['id'];
export const INQUIRY_COLUMN_IDS = INQUIRY_COLUMNS.map((c) => c.id) as [InquiryColumn, ...InquiryColumn[]];
/** The columns a phone shows on a card whatever the choice (name and stage are always there). */
export const ALWAYS_SHOWN: readonly InquiryColumn[] = ['name'];

/** Wall finishes as the trade names them; the keys are the estimating core's treatment kinds. */
export const FINISH_KINDS = [
  { id: 'shiplap', label: 'Shiplap' },
  { id: 'board-and-batten', label: 'Board and batten' },
  { id: 'beadboard', label: 'Beadboard' },
  { id: 'flat-panel', label: 'Flat panel' },
  { id: 'picture-frame', label: 'Picture frame' },
] as const;
export type FinishKind = (typeof FINISH_KINDS)[number]['id'];
const FINISH_KIND_IDS = FINISH_KINDS.map((f) => f.id) as [FinishKind, ...FinishKind[]];

/**
 * Price bands on the estimate's range, in whole units of the firm's currency. An inquiry is in a
 * band when its range overlaps it. The edges are our own choice for the filter menu.
 */
export const PRICE_BANDS = [
  { id: 'under-2500', label: 'Under 2,500', from: 0, to: 2_500 },
  { id: '2500-5000', label: '2,500 – 5,000', from: 2_500, to: 5_000 },
  { id: '5000-10000', label: '5,000 – 10,000', from: 5_000, to: 10_000 },
  { id: 'over-10000', label: 'Over 10,000', from: 10_000, to: null },
] as const;
export type PriceBand = (typeof PRICE_BANDS)[number]['id'];
const PRICE_BAND_IDS = PRICE_BANDS.map((b) => b.id) as [PriceBand, ...PriceBand[]];

export const ASSIGNEE_FILTER_WORDS = ['mine', 'unassigned'] as const;

export const PAGE_SIZES = [25, 50, 100] as const;
export const DEFAULT_PAGE_SIZE = 25;

const day = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, { error: 'Use a date like 2026-12-01.' });
const flag = z.enum(['1'], { error: 'Use 1 or leave it out.' }).optional();

/**
 * One view of the list as query parameters (all optional). `stage` takes one stage or several
 * separated by commas; `after` is the opaque cursor of the page before.
 */
export const inquiryListQuerySchema = z
  .strictObject({
    q: z.string().trim().max(100, { error: 'At most 100 characters.' }).optional(),
    stage: z
      .string()
      .transform((text) => text.split(',').filter(Boolean))
      .pipe(z.array(z.enum(LEAD_STAGE_IDS, { error: 'Not a stage.' })).max(LEAD_STAGE_IDS.length))
      .optional(),
    assignee: z.union([z.enum(ASSIGNEE_FILTER_WORDS), idSchema], { error: 'Use mine, unassigned or a teammate.' }).optional(),
    finish: z.enum(FINISH_KIND_IDS, { error: 'Not a finish.' }).optional(),
    price: z.enum(PRICE_BAND_IDS, { error: 'Not a price band.' }).optional(),
    from: day.optional(),
    to: day.optional(),
    photos: flag,
    visit: flag,
    overdue: flag,
    unread: flag,
    sort: z.enum(INQUIRY_COLUMN_IDS, { error: 'Not a column.' }).optional(),
    dir: z.enum(['asc', 'desc'], { error: 'Use asc or desc.' }).optional(),
    after: z.string().max(400, { error: 'Not a page of this list.' }).optional(),
    limit: z.coerce
      .number({ error: 'A number.' })
      .int({ error: 'A whole number.' })
      .refine((n) => (PAGE_SIZES as readonly number[]).includes(n), { error: `One of ${PAGE_SIZES.join(', ')}.` })
      .optional(),
  })
  .refine((q) => !q.from || !q.to || q.from <= q.to, { path: ['to'], error: 'The end is before the start.' });

export type InquiryListQuery = z.output<typeof inquiryListQuerySchema>;

/** The view's parameters without paging, in a fixed order (what the address bar and `?in=` carry). */
export const VIEW_PARAMS = ['q', 'stage', 'assignee', 'finish', 'price', 'from', 'to', 'photos', 'visit', 'overdue', 'unread', 'sort', 'dir'] as const;

/** A view as a query string, leaving out what is empty; the same view always gives the same string. */
export function viewSearchParams(view: Partial<Record<(typeof VIEW_PARAMS)[number] | 'after' | 'limit', string | undefined>>): URLSearchParams {
  const out = new URLSearchParams();
  for (const name of [...VIEW_PARAMS, 'limit', 'after'] as const) {
    const value = view[name];
    if (value !== undefined && value !== '') out.set(name, value);
  }
  return out;
}

/** Query parameters as a plain object for the schema (a repeated name keeps its last value). */
export function paramsObject(params: URLSearchParams): Record<string, string> {
  return Object.fromEntries(params.entries());
}

export type InquiryRow = {
  id: string;
  reference: string;
  name: string;
  /** The town when known, else the postcode. */
  place: string;
  finish: string;
  /** Covered (net) wall area in square feet; the island writes it in the firm's units. */
  areaSqFt: number;
  rangeLowCents: number;
  rangeHighCents: number;
  stage: LeadStage;
  assigneeName: string | null;
  receivedAt: string;
  /** Since when the homeowner has waited: the last contact, or when the inquiry arrived. */
  waitingSince: string;
  nextFollowUpAt: string | null;
  triageScore: number;
  /** No one on the staff has opened it yet. */
  unread: boolean;
  /** No first contact and past the firm's response target. */
  overdue: boolean;
  /** E.164, for a one-tap call. */
  phone: string;
};

export type InquiryListPage = {
  rows: InquiryRow[];
  /** Cursor of the next page, or null on the last one. */
  nextCursor: string | null;
  /** Inquiries per stage for the view's filters and search, whatever stage is picked. */
  counts: Record<LeadStage, number>;
};

/** The column choice a person keeps: which columns show, in the list's order. */
export const listColumnsSchema = z.strictObject({
  columns: z
    .array(z.enum(INQUIRY_COLUMN_IDS, { error: 'Not a column.' }))
    .min(1, { error: 'Keep at least one column.' })
    .max(INQUIRY_COLUMN_IDS.length)
    .refine((cols) => new Set(cols).size === cols.length, { error: 'Each column once.' }),
});
export type ListColumns = z.output<typeof listColumnsSchema>;
