/**
 * The Inquiries list as one keyset query per page: a firm's inquiries filtered, searched and sorted
 * on any column, a page at a time after an opaque cursor (never OFFSET, so page 50 costs what page 1
 * costs and rows that arrive meanwhile shift nothing), with a count per stage for the same view.
 * It reads only the lead's own columns (the list facts kept beside each lead), never its estimate.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { TZDate } from '@date-fns/tz';
import {
  DEFAULT_PAGE_SIZE,
  PRICE_BANDS,
  inquiryListQuerySchema,
  type InquiryColumn,
  type InquiryListPage,
  type InquiryListQuery,
  type InquiryRow,
} from '~/lib/shared/inquiry-list';
import { LEAD_STAGE_IDS, type LeadStage } from '~/lib/shared/labels';
import { now } from '../clock';
import { Company } from '../companies/company.entity';
import { InvalidInput } from '../errors';
import { decodeCursor, encodeCursor } from './list-cursor';
import { searchPatterns } from './list-search';

/** Who is asking: the firm every row must belong to, and the person "mine" means. */
export type ListViewer = { companyId: string; membershipId: string; timeZone: string };

type SortKey = { sql: string; type: 'text' | 'int' | 'timestamptz'; defaultDir: 'asc' | 'desc'; invert?: boolean };

const STAGE_ORDER = `array_position(array[${LEAD_STAGE_IDS.map((s) => `'${s}'`).join(', ')}]::text[], l."stage"::text)`;

/**
 * The SQL each column sorts by. Every key is never null (a missing follow-up sorts last, no one
 * assigned first), so a (key, id) pair orders every row exactly once. "Waiting" sorts by how long
 * the homeowner has waited: descending waiting is ascending "waiting since".
 */
const SORT_KEYS: Record<InquiryColumn, SortKey> = {
  reference: { sql: 'l."reference"', type: 'text', defaultDir: 'asc' },
  name: { sql: 'lower(l."name")', type: 'text', defaultDir: 'asc' },
  place: { sql: 'l."postcode"', type: 'text', defaultDir: 'asc' },
  finish: { sql: 'l."finish_label"', type: 'text', defaultDir: 'asc' },
  area: { sql: 'l."covered_sq_ft"', type: 'int', defaultDir: 'desc' },
  range: { sql: 'l."range_low_cents"', type: 'int', defaultDir: 'desc' },
  stage: { sql: STAGE_ORDER, type: 'int', defaultDir: 'asc' },
  assignee: { sql: `coalesce(lower(au."name"), '')`, type: 'text', defaultDir: 'asc' },
  received: { sql: 'l."created_at"', type: 'timestamptz', defaultDir: 'desc' },
  waiting: { sql: 'coalesce(l."last_contact_at", l."created_at")', type: 'timestamptz', defaultDir: 'desc', invert: true },
  followUp: { sql: `coalesce(l."next_follow_up_at", 'infinity'::timestamptz)`, type: 'timestamptz', defaultDir: 'asc' },
  score: { sql: 'l."triage_score"', type: 'int', defaultDir: 'desc' },
};

export const DEFAULT_SORT: InquiryColumn = 'received';

/** Stages that end an inquiry: nothing is overdue there. */
const ENDED: LeadStage[] = ['going-ahead', 'not-going-ahead'];
/** Until Visits exist, "has a visit" means a visit was booked: that stage or one after it. */
const VISITED: LeadStage[] = ['visit-booked', 'measured', 'quote-sent', 'going-ahead'];

const iso = (sql: string) => `to_json(${sql}) #>> '{}'`;

type Where = { sql: string[]; params: unknown[] };

function placeholders(values: readonly unknown[]): string {
  return values.map(() => '?').join(', ');
}

/** The start of a day in the firm's zone (`2026-12-01` → that midnight there). */
function startOfDayIn(day: string, timeZone: string, addDays = 0): Date {
  const [y, m, d] = day.split('-').map(Number) as [number, number, number];
  return new Date(new TZDate(y, m - 1, d + addDays, 0, 0, 0, 0, timeZone).getTime());
}

/** The view's conditions; `withStage: false` leaves out the stage, for the counts per stage. */
function viewWhere(viewer: ListViewer, query: InquiryListQuery, at: Date, options: { withStage: boolean }): Where {
  const sql = ['l."company_id" = ?', 'l."deleted_at" is null'];
  const params: unknown[] = [viewer.companyId];
  if (options.withStage && query.stage?.length) {
    sql.push(`l."stage" in (${placeholders(query.stage)})`);
    params.push(...query.stage);
  }
  if (query.assignee === 'mine') {
    sql.push('l."assignee_id" = ?');
    params.push(viewer.membershipId);
  } else if (query.assignee === 'unassigned') sql.push('l."assignee_id" is null');
  else if (query.assignee) {
    sql.push('l."assignee_id" = ?');
    params.push(query.assignee);
  }
  if (query.finish) {
    sql.push('l."finish_kinds" @> array[?]::text[]');
    params.push(query.finish);
  }
  if (query.price) {
    const band = PRICE_BANDS.find((b) => b.id === query.price)!;
    // The inquiry's range overlaps the band.
    sql.push('l."range_high_cents" >= ?');
    params.push(band.from * 100);
    if (band.to !== null) {
      sql.push('l."range_low_cents" < ?');
      params.push(band.to * 100);
    }
  }
  if (query.from) {
    sql.push('l."created_at" >= ?');
    params.push(startOfDayIn(query.from, viewer.timeZone));
  }
  if (query.to) {
    sql.push('l."created_at" < ?');
    params.push(startOfDayIn(query.to, viewer.timeZone, 1));
  }
  if (query.photos) sql.push('l."photo_count" > 0');
  if (query.visit) {
    sql.push(`l."stage" in (${placeholders(VISITED)})`);
    params.push(...VISITED);
  }
  if (query.overdue) {
    sql.push(`l."first_contact_at" is null and l."response_due_at" < ? and l."stage" not in (${placeholders(ENDED)})`);
    params.push(at, ...ENDED);
  }
  if (query.unread) sql.push('l."opened_at" is null');
  for (const pattern of searchPatterns(query.q ?? '')) {
    sql.push('l."search_text" like ?');
    params.push(pattern);
  }
  return { sql, params };
}

type RawRow = {
  id: string;
  reference: string;
  name: string;
  postcode: string;
  finish_label: string;
  covered_sq_ft: number;
  range_low_cents: number;
  range_high_cents: number;
  stage: LeadStage;
  assignee_name: string | null;
  received_at: string;
  waiting_since: string;
  next_follow_up_at: string | null;
  triage_score: number;
  unread: boolean;
  overdue: boolean;
  phone: string;
  sort_key: string;
};

function toRow(raw: RawRow): InquiryRow {
  return {
    id: raw.id,
    reference: raw.reference,
    name: raw.name,
    place: raw.postcode,
    finish: raw.finish_label,
    areaSqFt: Number(raw.covered_sq_ft),
    rangeLowCents: Number(raw.range_low_cents),
    rangeHighCents: Number(raw.range_high_cents),
    stage: raw.stage,
    assigneeName: raw.assignee_name,
    receivedAt: new Date(raw.received_at).toISOString(),
    waitingSince: new Date(raw.waiting_since).toISOString(),
    nextFollowUpAt: raw.next_follow_up_at ? new Date(raw.next_follow_up_at).toISOString() : null,
    triageScore: Number(raw.triage_score),
    unread: raw.unread,
    overdue: raw.overdue,
    phone: raw.phone,
  };
}

type Ordering = { column: InquiryColumn; dir: 'asc' | 'desc' };

function orderingOf(query: InquiryListQuery): Ordering {
  const column = query.sort ?? DEFAULT_SORT;
  return { column, dir: query.dir ?? SORT_KEYS[column].defaultDir };
}

/** The direction the SQL key runs in for a column's direction as people see it. */
function sqlDirection({ column, dir }: Ordering): 'asc' | 'desc' {
  return SORT_KEYS[column].invert ? (dir === 'asc' ? 'desc' : 'asc') : dir;
}

const FROM = `from "lead" l left join "membership" m on m."id" = l."assignee_id" left join "app_user" au on au."id" = m."user_id"`;

/** The SQL and parameters of one keyset page of a view. */
function selectSql(
  where: Where,
  ordering: Ordering,
  direction: 'asc' | 'desc',
  after: { key: string; id: string } | null,
  limit: number,
  at: Date,
): { sql: string; params: unknown[] } {
  const key = SORT_KEYS[ordering.column];
  const conditions = [...where.sql];
  const params = [...where.params];
  if (after) {
    conditions.push(`(${key.sql}, l."id") ${direction === 'asc' ? '>' : '<'} (?::${key.type}, ?::uuid)`);
    params.push(after.key, after.id);
  }
  const sql = `select l."id", l."reference", l."name", l."postcode", l."finish_label", l."covered_sq_ft", l."range_low_cents", l."range_high_cents",
      l."stage", au."name" as "assignee_name", ${iso('l."created_at"')} as "received_at",
      ${iso('coalesce(l."last_contact_at", l."created_at")')} as "waiting_since", ${iso('l."next_follow_up_at"')} as "next_follow_up_at",
      l."triage_score", l."opened_at" is null as "unread",
      (l."first_contact_at" is null and l."response_due_at" < ? and l."stage" not in (${placeholders(ENDED)})) as "overdue",
      l."phone", (${key.sql})::text as "sort_key"
    ${FROM}
    where ${conditions.join(' and ')}
    order by ${key.sql} ${direction}, l."id" ${direction}
    limit ?`;
  return { sql, params: [at, ...ENDED, ...params, limit] };
}

/**
 * Rows of the view strictly after (`after`) a (key, id) pair in the given SQL direction. The
 * query the list, the inquiry page's neighbours and the export all run.
 */
async function selectRows(
  em: EntityManager,
  where: Where,
  ordering: Ordering,
  direction: 'asc' | 'desc',
  after: { key: string; id: string } | null,
  limit: number,
  at: Date,
): Promise<RawRow[]> {
  const { sql, params } = selectSql(where, ordering, direction, after, limit, at);
  return em.getConnection().execute<RawRow[]>(sql, params);
}

/** PostgreSQL's plan for one page of a view, as run (EXPLAIN ANALYZE, BUFFERS): for `npm run bench` and for operators. */
export async function explainInquiryPage(em: EntityManager, viewer: ListViewer, query: InquiryListQuery): Promise<string> {
  const at = now();
  const ordering = orderingOf(query);
  const { sql, params } = selectSql(
    viewWhere(viewer, query, at, { withStage: true }),
    ordering,
    sqlDirection(ordering),
    cursorOf(query, ordering),
    (query.limit ?? DEFAULT_PAGE_SIZE) + 1,
    at,
  );
  const rows = await em.getConnection().execute<{ 'QUERY PLAN': string }[]>(`explain (analyze, buffers) ${sql}`, params);
  return rows.map((row) => row['QUERY PLAN']).join('\n');
}

/** The cursor a request carried, checked against the view's sort. */
function cursorOf(query: InquiryListQuery, ordering: Ordering): { key: string; id: string } | null {
  if (!query.after) return null;
  const cursor = decodeCursor(query.after);
  if (!cursor || cursor.sort !== ordering.column || cursor.dir !== ordering.dir) {
    throw new InvalidInput('That page belongs to another view of the list. Start again from the first page.', {
      after: 'Not a page of this view.',
    });
  }
  return cursor;
}

/** One page of the view and the cursor of the next. */
export async function listInquiries(em: EntityManager, viewer: ListViewer, query: InquiryListQuery): Promise<Omit<InquiryListPage, 'counts'>> {
  const at = now();
  const ordering = orderingOf(query);
  const after = cursorOf(query, ordering);
  const limit = query.limit ?? DEFAULT_PAGE_SIZE;
  const raws = await selectRows(em, viewWhere(viewer, query, at, { withStage: true }), ordering, sqlDirection(ordering), after, limit + 1, at);
  const page = raws.slice(0, limit);
  const last = page[page.length - 1];
  const nextCursor = raws.length > limit && last ? encodeCursor({ sort: ordering.column, dir: ordering.dir, key: last.sort_key, id: last.id }) : null;
  return { rows: page.map(toRow), nextCursor };
}

/** How many inquiries of the view are in each stage (the stage filter itself left out). */
export async function stageCounts(em: EntityManager, viewer: ListViewer, query: InquiryListQuery): Promise<Record<LeadStage, number>> {
  const where = viewWhere(viewer, query, now(), { withStage: false });
  const rows = await em
    .getConnection()
    .execute<{ stage: LeadStage; n: number }[]>(
      `select l."stage", count(*)::int as "n" from "lead" l where ${where.sql.join(' and ')} group by l."stage"`,
      where.params,
    );
  const counts = Object.fromEntries(LEAD_STAGE_IDS.map((stage) => [stage, 0])) as Record<LeadStage, number>;
  for (const row of rows) counts[row.stage] = Number(row.n);
  return counts;
}

export async function inquiryListPage(em: EntityManager, viewer: ListViewer, query: InquiryListQuery): Promise<InquiryListPage> {
  const [page, counts] = await Promise.all([listInquiries(em, viewer, query), stageCounts(em, viewer, query)]);
  return { ...page, counts };
}

/**
 * The inquiries just before and after one lead in a view's order (the inquiry page's Previous and
 * Next). The lead need not match the view's filters any more (it may have moved stage since).
 */
export async function neighboursInList(
  em: EntityManager,
  viewer: ListViewer,
  query: InquiryListQuery,
  leadId: string,
): Promise<{ previous: Pick<InquiryRow, 'id' | 'name' | 'reference'> | null; next: Pick<InquiryRow, 'id' | 'name' | 'reference'> | null }> {
  const at = now();
  const ordering = orderingOf(query);
  const key = SORT_KEYS[ordering.column];
  const [own] = await em
    .getConnection()
    .execute<{ sort_key: string }[]>(`select (${key.sql})::text as "sort_key" ${FROM} where l."id" = ? and l."company_id" = ? and l."deleted_at" is null`, [
      leadId,
      viewer.companyId,
    ]);
  if (!own) return { previous: null, next: null };
  const where = viewWhere(viewer, query, at, { withStage: true });
  const forward = sqlDirection(ordering);
  const backward = forward === 'asc' ? 'desc' : 'asc';
  const pair = { key: own.sort_key, id: leadId };
  const [next, previous] = await Promise.all([selectRows(em, where, ordering, forward, pair, 1, at), selectRows(em, where, ordering, backward, pair, 1, at)]);
  const brief = (raw: RawRow | undefined) => (raw ? { id: raw.id, name: raw.name, reference: raw.reference } : null);
  return { previous: brief(previous[0]), next: brief(next[0]) };
}

/** Every row of the view in its order, a batch at a time (the CSV export), so no request holds them all. */
export async function* allInquiries(em: EntityManager, viewer: ListViewer, query: InquiryListQuery, batch = 1000): AsyncGenerator<InquiryRow[]> {
  const at = now();
  const ordering = orderingOf(query);
  const where = viewWhere(viewer, query, at, { withStage: true });
  let after: { key: string; id: string } | null = null;
  for (;;) {
    const raws = await selectRows(em, where, ordering, sqlDirection(ordering), after, batch, at);
    if (raws.length === 0) return;
    yield raws.map(toRow);
    if (raws.length < batch) return;
    const last = raws[raws.length - 1]!;
    after = { key: last.sort_key, id: last.id };
  }
}

/** The list's viewer for a signed-in staff member (the firm's zone read once). */
export async function listViewerOf(em: EntityManager, staff: { companyId: string; membership: { id: string } }): Promise<ListViewer> {
  const company = await em.findOneOrFail(Company, { id: staff.companyId }, { fields: ['timeZone'] });
  return { companyId: staff.companyId, membershipId: staff.membership.id, timeZone: company.timeZone };
}

/**
 * Previous and Next for the inquiry page opened from the list (`?in=<the list's view>`); null when
 * it was not opened from the list or the view no longer parses.
 */
export async function neighboursFromListLink(
  em: EntityManager,
  staff: { companyId: string; membership: { id: string } },
  inList: string | null,
  leadId: string,
): Promise<(Awaited<ReturnType<typeof neighboursInList>> & { href: (id: string) => string }) | null> {
  if (inList === null) return null;
  const params = new URLSearchParams(inList);
  params.delete('after');
  params.delete('limit');
  const parsed = inquiryListQuerySchema.safeParse(Object.fromEntries(params.entries()));
  if (!parsed.success) return null;
  const found = await neighboursInList(em, await listViewerOf(em, staff), parsed.data, leadId);
  const link = new URLSearchParams({ in: params.toString() }).toString();
  return { ...found, href: (id) => `/app/leads/${id}?${link}` };
}
