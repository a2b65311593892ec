// The office's review queue: a dense, server-side table of every case (TanStack Table in
// manual mode: the API filters, sorts and pages), with its view kept in the URL.
import { gapWords } from '@/lib/vocabulary/pack';
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  useReactTable,
  type RowSelectionState,
  type SortingState,
} from '@tanstack/react-table';
import type { QueueItem, QueueSortKey } from '@/lib/schemas/queue';
import { CameraIcon, ChevronDownIcon, ChevronLeftIcon, ChevronRightIcon, ChevronUpIcon, InfoIcon, SendIcon, SpinnerIcon, StopIcon } from '@/components/icons';
import { apiCall, type ApiError } from './api';
import { daysSince, daysUntil, formatDay, plural, relativeDays } from './format';
import { LightBadge } from '@/components/readiness/light-badge';
import { QueueFilters, type Surveyor } from './queue-filters';
import { clearFilters, hasFilters, searchFromView, viewFromSearch, type QueueView } from './queue-state';
import { StagePill } from './stage-pill';
import { shortCheckName } from './check-names';

type Props = { initialSearch: string; surveyors: Surveyor[] };
type Page = { items: QueueItem[]; total: number; page: number; pageSize: number };
type ChaseAnswer = { sent: number; results: { caseId: string; sent: boolean; items: string[]; reason?: string }[] };
type Known = { reference: string; customer: string };

const pageSizes = [25, 50, 100, 200];
// Fixed widths so the ten columns fit a 1280 px screen; long e-mails and addresses are cut with an ellipsis.
const widths: Record<string, string> = {
  select: 'w-[36px]',
  customer: 'w-[190px]',
  address: 'w-[150px]',
  light: 'w-[160px]',
  gaps: 'w-[150px]',
  stage: 'w-[145px]',
  invited: 'w-[85px]',
  activity: 'w-[95px]',
  delivery: 'w-[95px]',
  surveyor: 'w-[125px]',
};
const column = createColumnHelper<QueueItem>();

function addressOf(r: QueueItem): string {
  return [r.addressLine1, r.town].filter(Boolean).join(', ');
}

function townAndPostcode(r: QueueItem): string {
  return [r.town, r.postcode].filter(Boolean).join(' · ');
}

function CustomerCell({ r }: { r: QueueItem }) {
  return (
    <div className="min-w-0">
      <a href={`/office/cases/${r.id}`} className="block truncate font-semibold text-ground-900" data-testid="case-link">
        {r.customerName || r.customerEmail}
      </a>
      <div className="truncate text-ground-600" title={r.customerEmail}>{r.customerEmail}</div>
      <div className="font-mono text-xs text-ground-500">{r.reference}</div>
      {r.changedSinceReadyAt && (
        <div className="mt-1 inline-block rounded bg-clay-100 px-1.5 py-0.5 text-xs font-semibold text-clay-800" data-testid="changed-since-ready">
          Changed since ready
        </div>
      )}
      {r.flaggedPhotos > 0 && (
        <div className="mt-1 inline-flex items-center gap-1 rounded bg-attention-soft px-1.5 py-0.5 text-xs font-semibold text-attention" data-testid="photos-flagged">
          <CameraIcon className="h-3.5 w-3.5" />
          {r.flaggedPhotos === 1 ? '1 photo flagged' : `${r.flaggedPhotos} photos flagged`}
        </div>
      )}
    </div>
  );
}

function GapsCell({ r }: { r: QueueItem }) {
  if (r.gapCount === 0) return <span className="text-ground-600">None</span>;
  const names = r.gaps.map(shortCheckName);
  const shown = names.slice(0, 3);
  return (
    <div title={r.gaps.join('\n')}>
      <span className="font-semibold">{r.gapCount}</span>
      <span className="text-xs text-ground-700">
        {' '}· {shown.join(', ')}
        {names.length > shown.length && <span className="text-ground-500"> +{names.length - shown.length}</span>}
      </span>
    </div>
  );
}

function ActivityCell({ at }: { at: string | null }) {
  if (!at) return <span className="text-ground-500">None yet</span>;
  return <span title={formatDay(at)}>{relativeDays(-daysSince(at))}</span>;
}

function DeliveryCell({ date }: { date: string | null }) {
  if (!date) return <span className="text-ground-500">Not given</span>;
  const n = daysUntil(date);
  return (
    <div className="whitespace-nowrap">
      <div>{formatDay(date)}</div>
      <div className={`text-xs ${n <= 14 ? 'font-semibold text-attention' : 'text-ground-600'}`}>{relativeDays(n)}</div>
    </div>
  );
}

function SurveyorCell({ r }: { r: QueueItem }) {
  if (!r.surveyorName) return <span className="text-ground-500">Not assigned</span>;
  return (
    <div className="whitespace-nowrap">
      <div>{r.surveyorName}</div>
      {r.surveyDate && <div className="text-xs text-ground-600">Survey {formatDay(r.surveyDate)}</div>}
    </div>
  );
}

function SkeletonRows({ columns }: { columns: number }) {
  return (
    <>
      {Array.from({ length: 8 }, (_, i) => (
        <tr key={i} className="border-t border-ground-100" aria-hidden="true">
          {Array.from({ length: columns }, (_, j) => (
            <td key={j} className="px-2 py-3">
              <div className={`h-3.5 animate-pulse rounded bg-ground-100 ${j === 0 ? 'w-4' : j === 1 ? 'w-36' : 'w-20'}`} />
            </td>
          ))}
        </tr>
      ))}
    </>
  );
}

function useQueue(view: QueueView) {
  const [data, setData] = useState<Page | null>(null);
  const [error, setError] = useState<ApiError | null>(null);
  const [loading, setLoading] = useState(true);
  const [tick, setTick] = useState(0);
  const search = searchFromView(view);
  useEffect(() => {
    const ctrl = new AbortController();
    setLoading(true);
    apiCall<Page>('GET', `/api/cases${search ? `?${search}` : ''}`, undefined, ctrl.signal)
      .then((r) => {
        if (r.ok) {
          setData(r.data);
          setError(null);
        } else setError(r.error);
        setLoading(false);
      })
      .catch(() => {});
    return () => ctrl.abort();
  }, [search, tick]);
  return { data, error, loading, reload: () => setTick((t) => t + 1) };
}

export default function QueueApp({ initialSearch, surveyors }: Props) {
  const initial = useMemo(() => viewFromSearch(initialSearch), [initialSearch]);
  const [view, setView] = useState<QueueView>(initial.view);
  const [searchText, setSearchText] = useState(initial.view.q);
  const [rowSelection, setRowSelection] = useState<RowSelectionState>({});
  const [known, setKnown] = useState<Record<string, Known>>({});
  const [chasing, setChasing] = useState(false);
  const [chaseMessage, setChaseMessage] = useState<{ tone: 'ok' | 'error'; text: string; details: string[] } | null>(null);
  const { data, error, loading, reload } = useQueue(view);
  const everLoaded = useRef(false);
  if (data) everLoaded.current = true;

  const change = useCallback((next: Partial<QueueView>) => setView((v) => ({ ...v, ...next })), []);

  // The view lives in the URL: bookmarkable, and restored on reload.
  useEffect(() => {
    const search = searchFromView(view);
    const url = `${window.location.pathname}${search ? `?${search}` : ''}`;
    if (url !== `${window.location.pathname}${window.location.search}`) window.history.replaceState(null, '', url);
  }, [view]);

  // Typing waits for a pause before asking the server.
  useEffect(() => {
    if (searchText === view.q) return;
    const t = setTimeout(() => change({ q: searchText, page: 1 }), 300);
    return () => clearTimeout(t);
  }, [searchText, view.q, change]);

  useEffect(() => {
    if (!data) return;
    setKnown((k) => ({ ...k, ...Object.fromEntries(data.items.map((r) => [r.id, { reference: r.reference, customer: r.customerName || r.customerEmail }])) }));
  }, [data]);

  const columns = useMemo(
    () => [
      column.display({
        id: 'select',
        header: ({ table }) => (
          <input
            type="checkbox"
            className="h-4 w-4 accent-ground-700"
            aria-label="Select every case on this page"
            checked={table.getIsAllPageRowsSelected()}
            ref={(el) => {
              if (el) el.indeterminate = table.getIsSomePageRowsSelected();
            }}
            onChange={table.getToggleAllPageRowsSelectedHandler()}
          />
        ),
        cell: ({ row }) => (
          <input
            type="checkbox"
            className="h-4 w-4 accent-ground-700"
            aria-label={`Select ${row.original.customerName || row.original.customerEmail}`}
            checked={row.getIsSelected()}
            onChange={row.getToggleSelectedHandler()}
          />
        ),
      }),
      column.accessor('customerName', { id: 'customer', header: 'Customer', cell: ({ row }) => <CustomerCell r={row.original} /> }),
      column.accessor((r) => addressOf(r), {
        id: 'address',
        header: 'Address',
        cell: ({ row }) => (
          <div className="min-w-0">
            <div className="truncate" title={addressOf(row.original)}>{row.original.addressLine1 || <span className="text-ground-500">No address yet</span>}</div>
            <div className="truncate text-ground-700">{townAndPostcode(row.original)}</div>
          </div>
        ),
      }),
      column.accessor('light', { id: 'light', header: 'Readiness', cell: ({ getValue }) => <LightBadge light={getValue()} /> }),
      column.accessor('gapCount', { id: 'gaps', header: 'Open checks', cell: ({ row }) => <GapsCell r={row.original} /> }),
      column.accessor('stage', { id: 'stage', header: 'Stage', cell: ({ getValue }) => <StagePill stage={getValue()} /> }),
      column.accessor('daysSinceInvite', {
        id: 'invited',
        header: 'Invited',
        cell: ({ row }) => (
          <div className="whitespace-nowrap" title={formatDay(row.original.invitedAt)}>
            {plural(row.original.daysSinceInvite, 'day')}
            <div className="text-xs text-ground-600">{formatDay(row.original.invitedAt)}</div>
          </div>
        ),
      }),
      column.accessor('lastCustomerActivityAt', { id: 'activity', header: 'Last activity', cell: ({ getValue }) => <ActivityCell at={getValue()} /> }),
      column.accessor('deliveryDate', { id: 'delivery', header: 'Car due', cell: ({ getValue }) => <DeliveryCell date={getValue()} /> }),
      column.accessor('surveyorName', { id: 'surveyor', header: 'Surveyor', cell: ({ row }) => <SurveyorCell r={row.original} /> }),
    ],
    [],
  );

  const sorting: SortingState = [{ id: view.sort, desc: view.dir === 'desc' }];
  const table = useReactTable({
    data: data?.items ?? [],
    columns,
    getRowId: (r) => r.id,
    getCoreRowModel: getCoreRowModel(),
    manualSorting: true,
    manualPagination: true,
    manualFiltering: true,
    enableMultiSort: false,
    enableSortingRemoval: false,
    rowCount: data?.total ?? 0,
    state: { sorting, rowSelection, pagination: { pageIndex: view.page - 1, pageSize: view.pageSize } },
    onRowSelectionChange: setRowSelection,
    onSortingChange: (updater) => {
      const next = typeof updater === 'function' ? updater(sorting) : updater;
      const first = next[0];
      if (first) change({ sort: first.id as QueueSortKey, dir: first.desc ? 'desc' : 'asc', page: 1 });
    },
  });

  const selectedIds = Object.keys(rowSelection).filter((id) => rowSelection[id]);
  const total = data?.total ?? 0;
  const pageCount = Math.max(1, Math.ceil(total / view.pageSize));
  const from = total === 0 ? 0 : (view.page - 1) * view.pageSize + 1;
  const to = Math.min(view.page * view.pageSize, total);
  const filtered = hasFilters(view);
  const csvSearch = searchFromView(view, { paging: false });

  async function chaseSelected() {
    setChasing(true);
    setChaseMessage(null);
    const r = await apiCall<ChaseAnswer>('POST', '/api/cases/chase', { caseIds: selectedIds });
    setChasing(false);
    if (!r.ok) {
      setChaseMessage({ tone: 'error', text: r.error.message, details: [] });
      return;
    }
    const skipped = r.data.results.filter((x) => !x.sent);
    setChaseMessage({
      tone: 'ok',
      text: `Chase e-mail sent to ${plural(r.data.sent, 'customer')}${skipped.length ? `; ${skipped.length} not sent` : ''}.`,
      details: skipped.map((x) => `${known[x.caseId]?.reference ?? 'Case'} (${known[x.caseId]?.customer ?? 'unknown'}): ${x.reason ?? 'not sent'}`),
    });
    setRowSelection({});
    reload();
  }

  const showSkeleton = loading && !everLoaded.current;
  const firstRun = !loading && !error && total === 0 && !filtered;
  const noMatch = !loading && !error && total === 0 && filtered;
  const headers = table.getHeaderGroups()[0]!.headers;

  return (
    <div className="space-y-3">
      <QueueFilters view={view} searchText={searchText} onSearchText={setSearchText} onChange={change} surveyors={surveyors} />
      {initial.invalid && (
        <p className="flex items-center gap-2 rounded-md border border-attention/30 bg-attention-soft px-3 py-2 text-sm text-ink">
          <InfoIcon className="h-4 w-4 text-attention" /> Some filters in that link were not valid, so the full queue is shown.
        </p>
      )}

      <div className="flex flex-wrap items-center gap-x-4 gap-y-2 text-sm">
        <p role="status" aria-live="polite" className="flex items-center gap-2 text-ground-800" data-testid="queue-count">
          {loading && <SpinnerIcon className="h-4 w-4 text-ground-600" />}
          {showSkeleton ? 'Loading cases…' : error ? 'Could not load the cases.' : total === 0 ? 'No cases' : `Showing ${from}–${to} of ${plural(total, 'case')}`}
        </p>
        {filtered && (
          <button type="button" className="font-semibold text-ground-700 underline decoration-ground-300 underline-offset-2" onClick={() => { setSearchText(''); setView(clearFilters(view)); }}>
            Clear filters
          </button>
        )}
        <div className="ml-auto flex flex-wrap items-center gap-2">
          {selectedIds.length > 0 && <span className="font-semibold text-ground-900" data-testid="selected-count">{selectedIds.length} selected</span>}
          <button type="button" className="btn-secondary min-h-[40px] px-3 py-1.5 text-sm" disabled={selectedIds.length === 0 || chasing} onClick={chaseSelected}>
            {chasing ? <SpinnerIcon className="h-4 w-4" /> : <SendIcon className="h-4 w-4" />}
            Chase selected
          </button>
          <a className="btn-secondary min-h-[40px] px-3 py-1.5 text-sm" href={`/api/cases.csv${csvSearch ? `?${csvSearch}` : ''}`} download>
            Export CSV
          </a>
        </div>
      </div>

      {chaseMessage && (
        <div role="alert" className={`rounded-md border px-3 py-2 text-sm ${chaseMessage.tone === 'ok' ? 'border-clear/30 bg-clear-soft' : 'border-blocked/30 bg-blocked-soft text-blocked'}`} data-testid="chase-result">
          <p className="font-semibold">{chaseMessage.text}</p>
          {chaseMessage.details.length > 0 && (
            <ul className="mt-1 list-disc pl-5">
              {chaseMessage.details.map((d) => <li key={d}>{d}</li>)}
            </ul>
          )}
        </div>
      )}

      {error ? (
        <div className="card flex items-start gap-3 border-blocked/30" role="alert">
          <StopIcon className="h-6 w-6 text-blocked" />
          <div>
            <p className="font-semibold text-blocked">{error.message}</p>
            {error.fields && (
              <ul className="mt-1 list-disc pl-5 text-sm">
                {Object.entries(error.fields).map(([k, v]) => <li key={k}>{k}: {v}</li>)}
              </ul>
            )}
            <div className="mt-3 flex gap-2">
              <button type="button" className="btn-secondary" onClick={reload}>Try again</button>
              {filtered && <button type="button" className="btn-secondary" onClick={() => { setSearchText(''); setView(clearFilters(view)); }}>Clear filters</button>}
            </div>
          </div>
        </div>
      ) : firstRun ? (
        <div className="card py-10 text-center" data-testid="queue-first-run">
          <h2 className="text-xl font-bold text-ground-900">No cases yet</h2>
          <p className="mx-auto mt-1 max-w-md text-ground-800">Invite a customer and their home appears here as soon as the invitation goes out. You can invite one at a time or import a CSV file.</p>
          <a href="/office/invite" className="btn-primary mt-4">Invite a customer</a>
        </div>
      ) : noMatch ? (
        <div className="card py-10 text-center" data-testid="queue-empty">
          <h2 className="text-xl font-bold text-ground-900">No cases match these filters</h2>
          <p className="mx-auto mt-1 max-w-md text-ground-800">Try a shorter search, or widen the readiness, stage or surveyor filters.</p>
          <button type="button" className="btn-primary mt-4" onClick={() => { setSearchText(''); setView(clearFilters(view)); }}>Clear filters</button>
        </div>
      ) : (
        <>
          {/* Wide screens: the dense table. It scrolls inside its own box, never the page. */}
          <div className="hidden overflow-x-auto rounded-lg border border-ground-100 bg-white shadow-sm md:block">
            <table className={`w-full min-w-[1230px] table-fixed text-left text-sm ${loading && !showSkeleton ? 'opacity-60' : ''}`} aria-busy={loading} data-testid="queue-table">
              <caption className="sr-only">Cases, {plural(total, 'case')}; column headers sort the table.</caption>
              <thead className="border-b border-ground-200 bg-ground-50 text-ground-800">
                <tr>
                  {headers.map((h) => {
                    const sortable = h.column.id !== 'select';
                    const active = view.sort === h.column.id;
                    return (
                      <th
                        key={h.id}
                        scope="col"
                        className={`whitespace-nowrap px-2 py-2 font-semibold ${widths[h.column.id] ?? ''}`}
                        aria-sort={sortable ? (active ? (view.dir === 'asc' ? 'ascending' : 'descending') : 'none') : undefined}
                      >
                        {sortable ? (
                          <button
                            type="button"
                            className="inline-flex items-center gap-1 rounded px-1 py-0.5 hover:bg-ground-100"
                            onClick={() => change({ sort: h.column.id as QueueSortKey, dir: active && view.dir === 'asc' ? 'desc' : 'asc', page: 1 })}
                          >
                            {flexRender(h.column.columnDef.header, h.getContext())}
                            {active ? (
                              view.dir === 'asc' ? <ChevronUpIcon className="h-4 w-4" /> : <ChevronDownIcon className="h-4 w-4" />
                            ) : (
                              <span className="inline-block h-4 w-4" aria-hidden="true" />
                            )}
                          </button>
                        ) : (
                          flexRender(h.column.columnDef.header, h.getContext())
                        )}
                      </th>
                    );
                  })}
                </tr>
              </thead>
              <tbody>
                {showSkeleton ? (
                  <SkeletonRows columns={headers.length} />
                ) : (
                  table.getRowModel().rows.map((row) => (
                    <tr key={row.id} className={`border-t border-ground-100 align-top hover:bg-paper ${row.getIsSelected() ? 'bg-ground-50' : ''}`} data-testid="queue-row">
                      {row.getVisibleCells().map((cell) => (
                        <td key={cell.id} className="overflow-hidden px-2 py-2">{flexRender(cell.column.columnDef.cell, cell.getContext())}</td>
                      ))}
                    </tr>
                  ))
                )}
              </tbody>
            </table>
          </div>

          {/* Phones: one card per case, same data, same selection. */}
          <div className="md:hidden">
            <div className="mb-2 flex items-center justify-between gap-2">
              <label className="flex items-center gap-2 text-sm font-semibold">
                <input type="checkbox" className="h-4 w-4 accent-ground-700" checked={table.getIsAllPageRowsSelected()} onChange={table.getToggleAllPageRowsSelectedHandler()} />
                Select all on this page
              </label>
              <label className="flex items-center gap-1 text-sm">
                <span className="sr-only">Sort by</span>
                <select
                  className="field-input min-h-[36px] py-1 text-sm"
                  value={`${view.sort}:${view.dir}`}
                  onChange={(e) => {
                    const [sort, dir] = e.target.value.split(':') as [QueueSortKey, 'asc' | 'desc'];
                    change({ sort, dir, page: 1 });
                  }}
                >
                  <option value="light:asc">Worst readiness first</option>
                  <option value="gaps:desc">Most open checks first</option>
                  <option value="delivery:asc">Car due soonest</option>
                  <option value="invited:asc">Invited longest ago</option>
                  <option value="activity:desc">Latest activity</option>
                  <option value="customer:asc">Customer A–Z</option>
                  <option value="stage:asc">Stage</option>
                  {!['light:asc', 'gaps:desc', 'delivery:asc', 'invited:asc', 'activity:desc', 'customer:asc', 'stage:asc'].includes(`${view.sort}:${view.dir}`) && (
                    <option value={`${view.sort}:${view.dir}`}>Sorted by {view.sort} ({view.dir === 'asc' ? 'ascending' : 'descending'})</option>
                  )}
                </select>
              </label>
            </div>
            <ul className={`space-y-2 ${loading && !showSkeleton ? 'opacity-60' : ''}`} aria-busy={loading}>
              {showSkeleton
                ? Array.from({ length: 5 }, (_, i) => <li key={i} className="h-28 animate-pulse rounded-lg border border-ground-100 bg-white" aria-hidden="true" />)
                : table.getRowModel().rows.map((row) => {
                    const r = row.original;
                    return (
                      <li key={row.id} className="rounded-lg border border-ground-100 bg-white p-3 shadow-sm" data-testid="queue-card">
                        <div className="flex items-start gap-3">
                          <input type="checkbox" className="mt-1 h-4 w-4 accent-ground-700" aria-label={`Select ${r.customerName || r.customerEmail}`} checked={row.getIsSelected()} onChange={row.getToggleSelectedHandler()} />
                          <div className="min-w-0 flex-1 text-sm">
                            <div className="flex flex-wrap items-start justify-between gap-2">
                              <CustomerCell r={r} />
                              <LightBadge light={r.light} />
                            </div>
                            <p className="mt-1 text-ground-800">{[addressOf(r), r.postcode].filter(Boolean).join(', ') || 'No address yet'}</p>
                            <div className="mt-2 flex flex-wrap items-center gap-2">
                              <StagePill stage={r.stage} />
                              <span className="text-ground-700">{r.gapCount === 0 ? 'No open checks' : `${gapWords.staffOpen(r.gapCount)}: ${r.gaps.map(shortCheckName).join(', ')}`}</span>
                            </div>
                            <dl className="mt-2 grid grid-cols-2 gap-x-3 gap-y-1 text-xs text-ground-700">
                              <div><dt className="inline font-semibold">Invited </dt><dd className="inline">{plural(r.daysSinceInvite, 'day')} ago</dd></div>
                              <div><dt className="inline font-semibold">Activity </dt><dd className="inline"><ActivityCell at={r.lastCustomerActivityAt} /></dd></div>
                              <div><dt className="inline font-semibold">Car due </dt><dd className="inline">{r.deliveryDate ? `${formatDay(r.deliveryDate)}` : 'not given'}</dd></div>
                              <div><dt className="inline font-semibold">Surveyor </dt><dd className="inline">{r.surveyorName ?? 'not assigned'}</dd></div>
                            </dl>
                          </div>
                        </div>
                      </li>
                    );
                  })}
            </ul>
          </div>

          <nav aria-label="Pages" className="flex flex-wrap items-center justify-between gap-3 text-sm">
            <label className="flex items-center gap-2">
              Rows per page
              <select className="field-input min-h-[36px] w-auto py-1 text-sm" value={view.pageSize} onChange={(e) => change({ pageSize: Number(e.target.value), page: 1 })}>
                {pageSizes.map((n) => <option key={n} value={n}>{n}</option>)}
              </select>
            </label>
            <div className="flex items-center gap-2">
              <button type="button" className="btn-secondary min-h-[36px] px-3 py-1" disabled={view.page <= 1 || loading} onClick={() => change({ page: view.page - 1 })}>
                <ChevronLeftIcon className="h-4 w-4" /> Previous
              </button>
              <span className="whitespace-nowrap">Page {view.page} of {pageCount}</span>
              <button type="button" className="btn-secondary min-h-[36px] px-3 py-1" disabled={view.page >= pageCount || loading} onClick={() => change({ page: view.page + 1 })}>
                Next <ChevronRightIcon className="h-4 w-4" />
              </button>
            </div>
          </nav>
        </>
      )}
    </div>
  );
}
