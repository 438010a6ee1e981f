import '~/lib/shared/zod-in-browser';
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import useSWR from 'swr';
import { flexRender, getCoreRowModel, useReactTable, type ColumnDef, type SortingState, type VisibilityState } from '@tanstack/react-table';
import { formatsFor, type FormatSettings } from '~/lib/shared/formats';
import {
  DEFAULT_PAGE_SIZE,
  FINISH_KINDS,
  INQUIRY_COLUMNS,
  PRICE_BANDS,
  type InquiryColumn,
  type InquiryListPage,
  type InquiryRow,
} from '~/lib/shared/inquiry-list';
import { LEAD_STAGES, stageLabel } from '~/lib/shared/labels';
import { viewFromParams, viewQueryString, waitingText, type View } from './view-state';

export type Teammate = { id: string; name: string };

type Props = {
  initialView: View;
  initialPage: InquiryListPage | null;
  initialColumns: InquiryColumn[];
  formats: FormatSettings;
  team: Teammate[];
  canExport: boolean;
  nowIso: string;
};

/** Columns that sort from the top by default in descending order (largest, newest, longest waiting first). */
const DESC_FIRST: InquiryColumn[] = ['area', 'range', 'received', 'waiting', 'score'];

class ListError extends Error {
  constructor(
    message: string,
    readonly fields: Record<string, string>,
  ) {
    super(message);
  }
}

async function fetchPage(url: string): Promise<InquiryListPage> {
  const response = await fetch(url, { headers: { accept: 'application/json' } });
  const body = await response.json();
  if (!response.ok) throw new ListError(body.error ?? 'The list could not be loaded.', body.fields ?? {});
  return body as InquiryListPage;
}

function isTyping(target: EventTarget | null): boolean {
  if (!(target instanceof HTMLElement)) return false;
  return target.isContentEditable || ['INPUT', 'SELECT', 'TEXTAREA'].includes(target.tagName);
}

export default function InquiriesList({ initialView, initialPage, initialColumns, formats, team, canExport, nowIso }: Props) {
  const fmt = useMemo(() => formatsFor(formats), [formats]);
  const [view, setView] = useState<View>(initialView);
  const [searchText, setSearchText] = useState(initialView.q ?? '');
  // Cursor of each page seen so far in this view: page i is fetched after cursors[i].
  const [cursors, setCursors] = useState<(string | null)[]>([null]);
  const [pageIndex, setPageIndex] = useState(0);
  // On a phone the filters fold away behind one button, so the first inquiries are in view.
  const [filtersOpen, setFiltersOpen] = useState(false);
  const [highlight, setHighlight] = useState(0);
  const [nowMs, setNowMs] = useState(() => Date.parse(nowIso));
  const [columns, setColumns] = useState<InquiryColumn[]>(initialColumns);
  const searchRef = useRef<HTMLInputElement>(null);
  const rowLinks = useRef<(HTMLAnchorElement | null)[]>([]);

  const viewQs = viewQueryString(view);
  const apiParams = new URLSearchParams(viewQs);
  if (cursors[pageIndex]) apiParams.set('after', cursors[pageIndex]!);
  const key = `/api/app/leads?${apiParams.toString()}`;
  const isFirstServerView = pageIndex === 0 && viewQs === viewQueryString(initialView);
  const { data, error, isLoading } = useSWR<InquiryListPage, ListError>(key, fetchPage, {
    refreshInterval: 15_000,
    keepPreviousData: true,
    fallbackData: isFirstServerView && initialPage ? initialPage : undefined,
    onSuccess: () => setNowMs(Date.now()),
  });
  const rows = useMemo(() => data?.rows ?? [], [data]);

  // A change of view starts again from the first page; the address bar follows.
  const changeView = useCallback((next: View, options: { replace?: boolean } = {}) => {
    setView(next);
    setCursors([null]);
    setPageIndex(0);
    setHighlight(0);
    const qs = viewQueryString(next);
    const url = `${window.location.pathname}${qs ? `?${qs}` : ''}`;
    if (options.replace) window.history.replaceState(null, '', url);
    else window.history.pushState(null, '', url);
  }, []);

  const setFilter = (name: keyof View, value: string | undefined, options?: { replace?: boolean }) => {
    const next = { ...view, [name]: value || undefined };
    if (!value) delete next[name];
    changeView(next, options);
  };

  // Back and forward restore the view they left.
  useEffect(() => {
    const onPop = () => {
      const restored = viewFromParams(new URLSearchParams(window.location.search));
      setView(restored);
      setSearchText(restored.q ?? '');
      setCursors([null]);
      setPageIndex(0);
      setHighlight(0);
    };
    window.addEventListener('popstate', onPop);
    return () => window.removeEventListener('popstate', onPop);
  }, []);

  // The search follows typing after a short pause, without filling the history.
  useEffect(() => {
    if ((view.q ?? '') === searchText.trim()) return;
    const timer = setTimeout(() => setFilter('q', searchText.trim(), { replace: true }), 250);
    return () => clearTimeout(timer);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [searchText]);

  const linkOf = useCallback((row: InquiryRow) => `/app/leads/${row.id}${viewQs ? `?in=${encodeURIComponent(viewQs)}` : '?in='}`, [viewQs]);

  // Keyboard: "/" searches, j/k move the highlighted row, Enter opens it (never while typing).
  useEffect(() => {
    const onKey = (event: KeyboardEvent) => {
      if (event.defaultPrevented || event.altKey || event.ctrlKey || event.metaKey || isTyping(event.target)) return;
      if (event.key === '/') {
        event.preventDefault();
        searchRef.current?.focus();
      } else if (event.key === 'j' || event.key === 'k') {
        event.preventDefault();
        setHighlight((h) => Math.max(0, Math.min(rows.length - 1, h + (event.key === 'j' ? 1 : -1))));
      } else if (event.key === 'Enter' && rows[highlight] && !(event.target instanceof HTMLAnchorElement || event.target instanceof HTMLButtonElement)) {
        event.preventDefault();
        window.location.assign(linkOf(rows[highlight]!));
      }
    };
    document.addEventListener('keydown', onKey);
    return () => document.removeEventListener('keydown', onKey);
  }, [rows, highlight, linkOf]);

  // React hydrates in a transition, so the island can look hydrated before this listener is on;
  // the attribute says the keys work (tests wait for it rather than guessing).
  const [keysReady, setKeysReady] = useState(false);
  useEffect(() => setKeysReady(true), []);

  useEffect(() => {
    rowLinks.current[highlight]?.closest('tr')?.scrollIntoView?.({ block: 'nearest' });
  }, [highlight]);

  const saveColumns = async (next: InquiryColumn[]) => {
    if (next.length === 0) return;
    setColumns(next);
    await fetch('/api/app/me/list-columns', { method: 'PUT', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ columns: next }) });
  };

  const sortColumn = (view.sort ?? 'received') as InquiryColumn;
  const sorting: SortingState = [{ id: sortColumn, desc: (view.dir ?? (DESC_FIRST.includes(sortColumn) ? 'desc' : 'asc')) === 'desc' }];
  const columnVisibility: VisibilityState = Object.fromEntries(INQUIRY_COLUMNS.map((c) => [c.id, columns.includes(c.id)]));

  const columnDefs = useMemo<ColumnDef<InquiryRow>[]>(() => {
    const defs: (ColumnDef<InquiryRow> & { id: InquiryColumn })[] = [
      { id: 'reference', header: 'Reference', cell: ({ row }) => <span className="figures">{row.original.reference}</span> },
      {
        id: 'name',
        header: 'Homeowner',
        cell: ({ row }) => {
          const index = row.index;
          return (
            <a ref={(el) => void (rowLinks.current[index] = el)} href={linkOf(row.original)} className={row.original.unread ? 'font-bold' : ''}>
              {row.original.unread && <span className="mr-1 inline-block h-2 w-2 rounded-full bg-lapwing align-middle" aria-hidden="true" />}
              {row.original.unread && <span className="sr-only">Unread: </span>}
              {row.original.name}
            </a>
          );
        },
      },
      { id: 'place', header: 'Town / postcode', cell: ({ row }) => row.original.place },
      { id: 'finish', header: 'Finish', cell: ({ row }) => row.original.finish },
      { id: 'area', header: 'Covered area', cell: ({ row }) => <span className="figures">{fmt.area(row.original.areaSqFt)}</span> },
      {
        id: 'range',
        header: 'Range',
        cell: ({ row }) => (
          <span className="figures whitespace-nowrap">
            {fmt.money(row.original.rangeLowCents, { wholeUnits: true })} – {fmt.money(row.original.rangeHighCents, { wholeUnits: true })}
          </span>
        ),
      },
      { id: 'stage', header: 'Stage', cell: ({ row }) => stageLabel(row.original.stage) },
      { id: 'assignee', header: 'Assigned to', cell: ({ row }) => row.original.assigneeName ?? <span className="text-slate">No one</span> },
      {
        id: 'received',
        header: 'Received',
        cell: ({ row }) => (
          <time dateTime={fmt.isoDate(row.original.receivedAt)} title={fmt.date(row.original.receivedAt, 'dateTime')} data-testid="lead-received">
            {fmt.date(row.original.receivedAt, 'day')}
          </time>
        ),
      },
      {
        id: 'waiting',
        header: 'Waiting',
        cell: ({ row }) => (
          <span className="whitespace-nowrap">
            {waitingText(row.original.waitingSince, nowMs)}
            {row.original.overdue && <span className="ml-1 rounded bg-brick px-1 text-xs font-bold text-white">Overdue</span>}
          </span>
        ),
      },
      {
        id: 'followUp',
        header: 'Next follow-up',
        cell: ({ row }) => (row.original.nextFollowUpAt ? fmt.date(row.original.nextFollowUpAt, 'day') : <span className="text-slate">—</span>),
      },
      { id: 'score', header: 'Triage score', cell: ({ row }) => <span className="figures">{row.original.triageScore}</span> },
    ];
    // The server sorts; tanstack only needs to know each column can, and which way it starts.
    return defs.map((def) => ({ ...def, accessorFn: (row: InquiryRow) => row.id, sortDescFirst: DESC_FIRST.includes(def.id) }));
  }, [fmt, linkOf, nowMs]);

  const table = useReactTable({
    data: rows,
    columns: columnDefs,
    getCoreRowModel: getCoreRowModel(),
    getRowId: (row) => row.id,
    manualSorting: true,
    manualPagination: true,
    enableSortingRemoval: false,
    state: { sorting, columnVisibility, pagination: { pageIndex, pageSize: DEFAULT_PAGE_SIZE } },
    onSortingChange: (updater) => {
      const next = typeof updater === 'function' ? updater(sorting) : updater;
      const [first] = next;
      if (first) changeView({ ...view, sort: first.id, dir: first.desc ? 'desc' : 'asc' });
    },
    onPaginationChange: (updater) => {
      const next = typeof updater === 'function' ? updater({ pageIndex, pageSize: DEFAULT_PAGE_SIZE }) : updater;
      if (next.pageIndex > pageIndex && data?.nextCursor) {
        setCursors((c) => [...c.slice(0, pageIndex + 1), data.nextCursor]);
        setPageIndex(next.pageIndex);
        setHighlight(0);
      } else if (next.pageIndex < pageIndex) {
        setPageIndex(next.pageIndex);
        setHighlight(0);
      }
    },
    pageCount: data?.nextCursor ? pageIndex + 2 : pageIndex + 1,
  });

  const selectedStages = view.stage ? view.stage.split(',') : [];
  const counts = data?.counts;
  const total = counts ? Object.values(counts).reduce((a, b) => a + b, 0) : null;
  const exportHref = `/api/app/leads/export${viewQs ? `?${viewQs}` : ''}`;

  return (
    <div data-keys-ready={keysReady ? 'true' : undefined}>
      <div className="flex flex-wrap items-end gap-3">
        <div className="min-w-[14rem] flex-1">
          <label htmlFor="inquiry-search" className="block text-sm font-medium">
            Search <span className="font-normal text-slate">(name, e-mail, phone, reference, street, postcode — press /)</span>
          </label>
          <input
            id="inquiry-search"
            ref={searchRef}
            type="search"
            value={searchText}
            onChange={(e) => setSearchText(e.target.value)}
            onKeyDown={(e) => {
              if (e.key === 'Escape') e.currentTarget.blur();
            }}
            maxLength={100}
            aria-describedby={error?.fields.q ? 'inquiry-search-error' : undefined}
            className="mt-1 w-full rounded border border-slate/40 px-2 py-1"
          />
          {error?.fields.q && (
            <p id="inquiry-search-error" className="text-sm text-brick">
              {error.fields.q}
            </p>
          )}
        </div>
        {canExport && (
          <a href={exportHref} className="rounded border border-lapwing px-3 py-1 text-sm text-lapwing no-underline" download>
            Download this view (CSV)
          </a>
        )}
      </div>

      <div role="group" aria-label="Stage" className="mt-3 flex flex-wrap gap-2">
        <button
          type="button"
          aria-pressed={selectedStages.length === 0}
          onClick={() => setFilter('stage', undefined)}
          className={`rounded-full border px-3 py-0.5 text-sm ${selectedStages.length === 0 ? 'border-lapwing bg-lapwing text-white' : 'border-slate/40 bg-white'}`}
        >
          All {total !== null && <span className="figures">({total})</span>}
        </button>
        {LEAD_STAGES.map((stage) => {
          const on = selectedStages.length === 1 && selectedStages[0] === stage.id;
          return (
            <button
              key={stage.id}
              type="button"
              aria-pressed={on}
              data-stage={stage.id}
              onClick={() => setFilter('stage', on ? undefined : stage.id)}
              className={`rounded-full border px-3 py-0.5 text-sm ${on ? 'border-lapwing bg-lapwing text-white' : 'border-slate/40 bg-white'}`}
            >
              {stage.label} {counts && <span className="figures">({counts[stage.id]})</span>}
            </button>
          );
        })}
      </div>

      <button
        type="button"
        className="mt-3 rounded border border-slate/40 bg-white px-3 py-1 text-sm sm:hidden"
        aria-expanded={filtersOpen}
        aria-controls="inquiry-filters"
        onClick={() => setFiltersOpen((open) => !open)}
      >
        {filtersOpen ? 'Hide filters' : 'Filters'}
        {activeFilterCount(view) > 0 && ` (${activeFilterCount(view)} on)`}
      </button>
      <fieldset id="inquiry-filters" className={`mt-3 ${filtersOpen ? 'flex' : 'hidden'} flex-wrap items-end gap-3 text-sm sm:flex`}>
        <legend className="sr-only">Filters</legend>
        <label>
          <span className="block">Assigned to</span>
          <select value={view.assignee ?? ''} onChange={(e) => setFilter('assignee', e.target.value)} className="rounded border border-slate/40 px-1 py-1">
            <option value="">Anyone</option>
            <option value="mine">Me</option>
            <option value="unassigned">No one</option>
            {team.map((t) => (
              <option key={t.id} value={t.id}>
                {t.name}
              </option>
            ))}
          </select>
        </label>
        <label>
          <span className="block">Finish</span>
          <select value={view.finish ?? ''} onChange={(e) => setFilter('finish', e.target.value)} className="rounded border border-slate/40 px-1 py-1">
            <option value="">Any</option>
            {FINISH_KINDS.map((f) => (
              <option key={f.id} value={f.id}>
                {f.label}
              </option>
            ))}
          </select>
        </label>
        <label>
          <span className="block">Price band ({formats.currency})</span>
          <select value={view.price ?? ''} onChange={(e) => setFilter('price', e.target.value)} className="rounded border border-slate/40 px-1 py-1">
            <option value="">Any</option>
            {PRICE_BANDS.map((b) => (
              <option key={b.id} value={b.id}>
                {b.label}
              </option>
            ))}
          </select>
        </label>
        <label>
          <span className="block">Received from</span>
          <input type="date" value={view.from ?? ''} onChange={(e) => setFilter('from', e.target.value)} className="rounded border border-slate/40 px-1" />
        </label>
        <label>
          <span className="block">to</span>
          <input type="date" value={view.to ?? ''} onChange={(e) => setFilter('to', e.target.value)} className="rounded border border-slate/40 px-1" />
          {error?.fields.to && <span className="block text-brick">{error.fields.to}</span>}
        </label>
        {(
          [
            ['photos', 'Has photos'],
            ['visit', 'Has a visit'],
            ['overdue', 'Overdue'],
            ['unread', 'Unread'],
          ] as const
        ).map(([name, label]) => (
          <label key={name} className="flex items-center gap-1">
            <input type="checkbox" checked={view[name] === '1'} onChange={(e) => setFilter(name, e.target.checked ? '1' : undefined)} />
            {label}
          </label>
        ))}
        <details className="relative">
          <summary className="cursor-pointer rounded border border-slate/40 bg-white px-2 py-1">Columns</summary>
          <div className="absolute z-10 mt-1 w-56 rounded border border-slate/30 bg-white p-2 shadow">
            {INQUIRY_COLUMNS.map((c) => (
              <label key={c.id} className="flex items-center gap-2 py-0.5">
                <input
                  type="checkbox"
                  checked={columns.includes(c.id)}
                  disabled={columns.length === 1 && columns.includes(c.id)}
                  onChange={(e) => void saveColumns(e.target.checked ? [...columns, c.id] : columns.filter((x) => x !== c.id))}
                />
                {c.label}
              </label>
            ))}
          </div>
        </details>
      </fieldset>

      {error && !Object.keys(error.fields).length && (
        <p role="alert" className="mt-3 text-brick">
          {error.message}
        </p>
      )}
      <p className="sr-only" aria-live="polite">
        {isLoading ? 'Loading inquiries' : `${rows.length} inquiries on this page`}
      </p>

      {rows.length === 0 && !isLoading ? (
        <p className="mt-4 text-slate">
          {total === 0 && !viewQs ? 'No inquiries yet. Put the price widget on your website and they will appear here.' : 'No inquiries match this view.'}
        </p>
      ) : (
        <>
          <table className="mt-4 hidden w-full bg-white text-sm sm:table" aria-label="Inquiries">
            <thead className="text-left text-slate">
              {table.getHeaderGroups().map((group) => (
                <tr key={group.id}>
                  {group.headers.map((header) => {
                    const sorted = header.column.getIsSorted();
                    return (
                      <th
                        key={header.id}
                        scope="col"
                        aria-sort={sorted ? (sorted === 'desc' ? 'descending' : 'ascending') : 'none'}
                        className="px-2 py-1 font-medium"
                      >
                        <button type="button" onClick={header.column.getToggleSortingHandler()} className="text-left">
                          {flexRender(header.column.columnDef.header, header.getContext())}
                          <span aria-hidden="true">{sorted === 'asc' ? ' ▲' : sorted === 'desc' ? ' ▼' : ''}</span>
                        </button>
                      </th>
                    );
                  })}
                </tr>
              ))}
            </thead>
            <tbody>
              {table.getRowModel().rows.map((row) => (
                <tr
                  key={row.id}
                  data-testid="inquiry-row"
                  data-highlighted={row.index === highlight || undefined}
                  aria-current={row.index === highlight ? 'true' : undefined}
                  className={`border-t border-slate/10 ${row.index === highlight ? 'bg-sawdust/40 outline outline-2 outline-lapwing' : ''}`}
                  onMouseEnter={() => setHighlight(row.index)}
                >
                  {row.getVisibleCells().map((cell) => (
                    <td key={cell.id} className="px-2 py-1">
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>

          <ul className="mt-4 space-y-2 sm:hidden" aria-label="Inquiries">
            {rows.map((row, index) => (
              <li
                key={row.id}
                data-testid="inquiry-card"
                className={`rounded border bg-white p-3 ${index === highlight ? 'border-lapwing' : 'border-slate/20'}`}
              >
                <div className="flex items-start justify-between gap-2">
                  <a href={linkOf(row)} className={`text-base ${row.unread ? 'font-bold' : ''}`}>
                    {row.unread && <span className="mr-1 inline-block h-2 w-2 rounded-full bg-lapwing align-middle" aria-hidden="true" />}
                    {row.unread && <span className="sr-only">Unread: </span>}
                    {row.name}
                  </a>
                  <a
                    href={`tel:${row.phone}`}
                    className="shrink-0 rounded bg-lapwing px-3 py-2 text-sm font-bold text-white no-underline"
                    aria-label={`Call ${row.name}`}
                  >
                    Call
                  </a>
                </div>
                <p className="mt-1 text-sm text-slate">
                  {stageLabel(row.stage)} · {row.place} · waiting {waitingText(row.waitingSince, nowMs)}
                  {row.overdue && <span className="ml-1 rounded bg-brick px-1 text-xs font-bold text-white">Overdue</span>}
                </p>
                <p className="figures text-sm">
                  {fmt.money(row.rangeLowCents, { wholeUnits: true })} – {fmt.money(row.rangeHighCents, { wholeUnits: true })} · {row.finish}
                </p>
              </li>
            ))}
          </ul>
        </>
      )}

      <nav aria-label="Pages" className="mt-3 flex items-center gap-3 text-sm">
        <button
          type="button"
          onClick={() => table.previousPage()}
          disabled={!table.getCanPreviousPage()}
          className="rounded border border-slate/40 px-3 py-1 disabled:opacity-40"
        >
          Previous page
        </button>
        <span>Page {pageIndex + 1}</span>
        <button
          type="button"
          onClick={() => table.nextPage()}
          disabled={!table.getCanNextPage()}
          className="rounded border border-slate/40 px-3 py-1 disabled:opacity-40"
        >
          Next page
        </button>
        <span className="text-slate">Keys: / search · j and k move · Enter opens</span>
      </nav>
    </div>
  );
}

/** How many of the filters under the Filters button narrow the view (stage and search are outside it). */
function activeFilterCount(view: View): number {
  return (['assignee', 'finish', 'price', 'from', 'to', 'photos', 'visit', 'overdue', 'unread'] as const).filter((name) => Boolean(view[name])).length;
}
