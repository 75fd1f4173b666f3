'use client';

import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  useReactTable,
  type SortingState,
} from '@tanstack/react-table';
import Link from 'next/link';
import { usePathname, useRouter, useSearchParams } from 'next/navigation';
import { useCallback, useMemo } from 'react';
import { EmptyState } from '@/features/ui/page';
import { useShopTime } from '@/features/ui/shop-time-zone';
import { boardFiltersFrom, useJobs, type BoardFilters as Filters } from '../api/get-jobs';
import type { BoardRow } from '../server/board';
import { BoardFilters } from './board-filters';
import { StateBadge } from './state-badge';

const col = createColumnHelper<BoardRow>();
const SORTABLE = new Set(['number', 'state', 'customer', 'due']);

const columns = [
  col.accessor('number', {
    header: 'Job',
    cell: (c) => (
      <Link
        href={`/jobs/${c.row.original.id}`}
        className="min-h-touch text-work inline-flex items-center font-bold underline"
      >
        #{c.getValue()}
      </Link>
    ),
  }),
  col.accessor('state', { header: 'State', cell: (c) => <StateBadge state={c.getValue()} /> }),
  col.accessor('customer', { header: 'Customer' }),
  col.accessor('vehicle', { header: 'Vehicle', enableSorting: false }),
  col.accessor('wheelCount', { header: 'Wheels', enableSorting: false }),
  col.accessor((r) => r.assignee?.name ?? '—', {
    id: 'assignee',
    header: 'Assigned to',
    enableSorting: false,
  }),
  col.accessor('dueAt', {
    id: 'due',
    header: 'Due',
    cell: (c) => <DueTime dueAt={c.getValue()} state={c.row.original.state} />,
  }),
];

/** A due time on the shop's clock, marked when it is past or later today on the shop's calendar. */
function DueTime({ dueAt, state }: { dueAt: string | null; state: BoardRow['state'] }) {
  const clock = useShopTime();
  if (!dueAt) return '—';
  const status = state === 'signed_off' ? 'later' : clock.dueStatus(dueAt);
  return (
    <time dateTime={dueAt} className={status === 'overdue' ? 'text-danger font-bold' : ''}>
      {clock.format(dueAt)}
      {status === 'overdue' ? ' (overdue)' : status === 'today' ? ' (today)' : ''}
    </time>
  );
}

/**
 * The live board: filters, sort and page live in the URL; rows come from GET /api/jobs through
 * TanStack Query, refreshed while the page is open.
 */
export function Board({
  people,
  defaultAssignee,
  canCreate,
}: {
  people: { id: string; name: string }[];
  defaultAssignee?: string;
  canCreate: boolean;
}) {
  const router = useRouter();
  const pathname = usePathname();
  const search = useSearchParams();
  const { shown: filters, api: apiFilters } = useMemo(
    () => boardFiltersFrom((k) => search.get(k), defaultAssignee),
    [search, defaultAssignee],
  );
  const { data, isPending, isError, error, isFetching, refetch } = useJobs(apiFilters);

  const update = useCallback(
    (next: Partial<Filters>) => {
      const params = new URLSearchParams(search.toString());
      for (const [k, v] of Object.entries(next)) {
        if (v) params.set(k, v);
        else params.delete(k);
      }
      router.replace(`${pathname}?${params}`, { scroll: false });
    },
    [router, pathname, search],
  );

  const sorting: SortingState = [{ id: filters.sort ?? 'due', desc: filters.dir === 'desc' }];
  // The app does not use the React Compiler, so the table's unmemoisable API is fine here.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data: data?.data ?? [],
    columns,
    state: { sorting },
    manualSorting: true,
    manualPagination: true,
    getCoreRowModel: getCoreRowModel(),
  });

  const page = Number(filters.page ?? 1);
  const pages = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1;
  const onlyMine = filters.assignee === 'me' && !filters.state && !filters.due && !filters.q;
  const filtered = Boolean(
    filters.state || filters.due || filters.q || (filters.assignee && filters.assignee !== 'all'),
  );

  return (
    <div>
      <BoardFilters filters={filters} people={people} onChange={update} />
      <p aria-live="polite" className="text-ink-soft mb-2 text-sm">
        {isPending
          ? 'Loading job cards…'
          : isError
            ? ''
            : `${data.total} job card${data.total === 1 ? '' : 's'}${isFetching ? ' · refreshing' : ''}`}
      </p>
      {isError ? (
        <div
          role="alert"
          className="border-danger bg-danger-tint text-danger rounded-lg border-2 p-3 font-semibold"
        >
          {error.message}{' '}
          <button type="button" onClick={() => void refetch()} className="underline">
            Try again
          </button>
        </div>
      ) : null}
      {data && data.total === 0 ? (
        filtered ? (
          <EmptyState
            title={
              onlyMine ? 'No job cards assigned to you yet' : 'No job cards match these filters'
            }
          >
            <button
              type="button"
              onClick={() =>
                update({
                  state: undefined,
                  due: undefined,
                  q: undefined,
                  assignee: 'all',
                  page: undefined,
                })
              }
              className="min-h-touch text-work font-semibold underline"
            >
              Show every job card
            </button>
          </EmptyState>
        ) : (
          <EmptyState title="No job cards yet">
            {canCreate ? (
              <Link href="/jobs/new" className="text-work font-semibold underline">
                Create the first job card
              </Link>
            ) : (
              'Job cards for the shop’s wheels appear here when a lead creates them.'
            )}
          </EmptyState>
        )
      ) : null}
      {data && data.total > 0 ? (
        <>
          <MobileSort
            sort={filters.sort ?? 'due'}
            dir={filters.dir ?? 'asc'}
            onChange={(sort, dir) => update({ sort, dir, page: undefined })}
          />
          <ul className="flex flex-col gap-3 sm:hidden" aria-label="Job cards">
            {data.data.map((r) => (
              <li key={r.id}>
                <Link
                  href={`/jobs/${r.id}`}
                  className="min-h-touch border-paper-line hover:bg-paper-dim flex flex-col gap-1 rounded-xl border-2 p-3"
                >
                  <span className="flex items-center justify-between gap-2">
                    <span className="text-work text-lg font-bold underline">#{r.number}</span>
                    <StateBadge state={r.state} />
                  </span>
                  <span className="font-semibold">{r.customer}</span>
                  <span>
                    {r.vehicle} · {r.wheelCount} wheel{r.wheelCount === 1 ? '' : 's'}
                  </span>
                  <span className="text-ink-soft text-sm">
                    {r.assignee ? r.assignee.name : 'Not assigned'}
                    {r.dueAt ? (
                      <>
                        {' · due '}
                        <DueTime dueAt={r.dueAt} state={r.state} />
                      </>
                    ) : null}
                  </span>
                </Link>
              </li>
            ))}
          </ul>
          <div className="hidden overflow-x-auto sm:block">
            <table className="w-full border-collapse text-left">
              <caption className="sr-only">Job cards, sorted by {sorting[0]!.id}</caption>
              <thead>
                {table.getHeaderGroups().map((hg) => (
                  <tr key={hg.id} className="border-ink border-b-2">
                    {hg.headers.map((h) => {
                      const sorted = filters.sort ? filters.sort === h.id : h.id === 'due';
                      const dir = sorted
                        ? filters.dir === 'desc'
                          ? 'descending'
                          : 'ascending'
                        : 'none';
                      return (
                        <th
                          key={h.id}
                          scope="col"
                          aria-sort={SORTABLE.has(h.id) ? dir : undefined}
                          className="p-2 whitespace-nowrap"
                        >
                          {SORTABLE.has(h.id) ? (
                            <button
                              type="button"
                              className="min-h-touch inline-flex items-center gap-1 font-bold"
                              onClick={() =>
                                update({
                                  sort: h.id,
                                  dir: sorted && filters.dir !== 'desc' ? 'desc' : 'asc',
                                  page: undefined,
                                })
                              }
                            >
                              {flexRender(h.column.columnDef.header, h.getContext())}
                              <span aria-hidden>
                                {sorted ? (dir === 'descending' ? '▼' : '▲') : '↕'}
                              </span>
                            </button>
                          ) : (
                            flexRender(h.column.columnDef.header, h.getContext())
                          )}
                        </th>
                      );
                    })}
                  </tr>
                ))}
              </thead>
              <tbody>
                {table.getRowModel().rows.map((row) => (
                  <tr key={row.id} className="border-paper-line border-b align-middle">
                    {row.getVisibleCells().map((cell) => (
                      <td key={cell.id} className="p-2">
                        {flexRender(cell.column.columnDef.cell, cell.getContext())}
                      </td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <nav aria-label="Board pages" className="mt-4 flex items-center justify-between gap-2">
            <button
              type="button"
              disabled={page <= 1}
              onClick={() => update({ page: String(page - 1) })}
              className="min-h-touch border-ink rounded-lg border-2 px-4 font-semibold disabled:opacity-40"
            >
              ← Previous
            </button>
            <span>
              Page {page} of {pages}
            </span>
            <button
              type="button"
              disabled={page >= pages}
              onClick={() => update({ page: String(page + 1) })}
              className="min-h-touch border-ink rounded-lg border-2 px-4 font-semibold disabled:opacity-40"
            >
              Next →
            </button>
          </nav>
        </>
      ) : null}
    </div>
  );
}

const SORT_OPTIONS = [
  ['due:asc', 'Due, soonest first'],
  ['due:desc', 'Due, latest first'],
  ['number:desc', 'Newest job first'],
  ['number:asc', 'Oldest job first'],
  ['state:asc', 'State'],
  ['customer:asc', 'Customer A–Z'],
] as const;

/** On a phone the table becomes cards; sorting moves to one select. */
function MobileSort({
  sort,
  dir,
  onChange,
}: {
  sort: string;
  dir: string;
  onChange: (sort: string, dir: string) => void;
}) {
  return (
    <label className="mb-3 flex flex-col gap-1 font-semibold sm:hidden">
      Sort
      <select
        value={`${sort}:${dir}`}
        onChange={(e) => {
          const [s, d] = e.target.value.split(':');
          onChange(s!, d!);
        }}
        className="min-h-touch border-ink-soft bg-paper rounded-lg border-2 px-3 text-base"
      >
        {SORT_OPTIONS.map(([value, text]) => (
          <option key={value} value={value}>
            {text}
          </option>
        ))}
      </select>
    </label>
  );
}
