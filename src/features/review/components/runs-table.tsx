import { Link } from 'react-router-dom';
import { createColumnHelper, flexRender, getCoreRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { ArrowDown, ArrowUp, ArrowUpDown, Download } from 'lucide-react';
import { Pager } from '../../../components/ui/pager';
import { useReviewRuns } from '../api/get-review-runs';
import { reviewSortFields, type ReviewSortField } from '../../../../shared/review/query';
import type { ReviewRunRow } from '../../../../shared/review/responses';
import { formatDateTime, formatInstantDay as formatDay, formatTime } from '../lib/format';
import { reviewCsvHref, toSearchParams, type ReviewRunsQuery } from '../lib/review-query';
import { attentionLook, Badge, noteLook, outcomeFor, PhaseLabel } from './status-badges';

const column = createColumnHelper<ReviewRunRow>();

const columns = [
  column.accessor('createdAt', {
    id: 'createdAt',
    header: 'Run',
    cell: (c) => (
      <Link
        to={`/review/runs/${c.row.original.id}`}
        state={{ reviewSearch: (c.table.options.meta as { search?: string } | undefined)?.search }}
        className="inline-flex min-h-target items-center font-semibold underline decoration-ink/30 underline-offset-4"
        aria-label={`Open the run of ${c.row.original.athleteName} on ${formatDateTime(c.getValue())}`}
      >
        <span className="flex flex-col leading-tight">
          <span className="whitespace-nowrap">{formatDay(c.getValue())}</span>
          <span className="font-normal tabular-nums">{formatTime(c.getValue())}</span>
        </span>
      </Link>
    ),
  }),
  column.accessor('athleteName', {
    id: 'athleteName',
    header: 'Athlete',
    cell: (c) => (
      <>
        <span className="block font-medium">{c.getValue()}</span>
        <span className="block whitespace-nowrap text-sm capitalize text-ink-muted">{c.row.original.injuryLabel}</span>
      </>
    ),
  }),
  column.accessor('therapistName', { id: 'therapistName', header: 'Therapist' }),
  column.accessor('phase', { id: 'phase', header: 'Phase', cell: (c) => <PhaseLabel phase={c.getValue()} /> }),
  column.accessor('outcome', { id: 'outcome', header: 'Outcome', // Table mode's own word where it says more (stop, elevate and refer is filed with the fall backs).
    cell: (c) => <Badge look={outcomeFor(c.row.original.runOutcome ?? c.getValue(), c.row.original.status)} />,
  }),
  column.accessor('attention', {
    header: 'Needs attention',
    enableSorting: false,
    cell: (c) =>
      c.getValue().length ? (
        <ul className="flex flex-wrap gap-1" aria-label="Needs attention">
          {c.getValue().map((kind) => (
            <li key={kind}>
              <Badge look={attentionLook[kind]} />
            </li>
          ))}
        </ul>
      ) : (
        <span className="text-ink-muted">—</span>
      ),
  }),
  column.accessor('noteStatus', { header: 'Session note', enableSorting: false, cell: (c) => <Badge look={noteLook[c.getValue()]} /> }),
];

const isSortField = (id: string): id is ReviewSortField => (reviewSortFields as readonly string[]).includes(id);
const sortIcon = { asc: ArrowUp, desc: ArrowDown, none: ArrowUpDown };

/** Runs of the clinic, paged and sorted by the server; the query (and so the address bar) is the table's whole state. */
export function RunsTable({ query, onChange }: { query: ReviewRunsQuery; onChange: (next: Partial<ReviewRunsQuery>, keepPage?: boolean) => void }) {
  const runs = useReviewRuns(query);
  const sorting: SortingState = [{ id: query.sort, desc: query.direction === 'desc' }];
  const table = useReactTable({
    data: runs.data?.items ?? [],
    columns,
    getRowId: (row) => row.id,
    meta: { search: toSearchParams(query).toString() },
    state: { sorting, pagination: { pageIndex: query.page - 1, pageSize: query.pageSize } },
    manualSorting: true,
    manualPagination: true,
    enableSortingRemoval: false,
    enableMultiSort: false,
    rowCount: runs.data?.total ?? 0,
    onSortingChange: (updater) => {
      const next = (typeof updater === 'function' ? updater(sorting) : updater)[0];
      if (next && isSortField(next.id)) onChange({ sort: next.id, direction: next.desc ? 'desc' : 'asc' });
    },
    onPaginationChange: (updater) => {
      const next = typeof updater === 'function' ? updater({ pageIndex: query.page - 1, pageSize: query.pageSize }) : updater;
      onChange({ page: next.pageIndex + 1 }, true);
    },
    getCoreRowModel: getCoreRowModel(),
  });

  const total = runs.data?.total ?? 0;
  const first = total === 0 ? 0 : (query.page - 1) * query.pageSize + 1;
  const last = Math.min(total, query.page * query.pageSize);

  return (
    <section aria-labelledby="runs-heading" className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h2 id="runs-heading" className="text-xl font-semibold">
          Runs
        </h2>
        <p className="text-sm text-ink-muted" role="status" aria-live="polite">
          {runs.isPending
            ? 'Loading…'
            : // Past 1,000 further runs the server stops counting: say "more than" rather than a wrong number.
              `${first}–${last} of ${runs.data?.totalExact === false ? 'more than ' : ''}${total.toLocaleString('en-GB')} ${total === 1 ? 'run' : 'runs'}`}
          {runs.isFetching && !runs.isPending ? ' · updating…' : ''}
        </p>
        <a
          href={reviewCsvHref(query)}
          download
          className="inline-flex min-h-target items-center gap-2 rounded-lg border border-ink/25 bg-paper-raised px-4 py-2 font-medium hover:bg-paper-sunk"
        >
          <Download aria-hidden className="h-4 w-4" /> Download CSV of these runs
        </a>
      </div>

      {runs.isError ? <p className="text-ember-700">{runs.error.message}</p> : null}

      <div className="overflow-x-auto rounded-xl bg-paper-raised ring-1 ring-ink/10">
        <table className="w-full text-left">
          <caption className="sr-only">Runs of your clinic; rows that need attention say why in the Needs attention column</caption>
          <thead className="bg-paper-sunk text-sm">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted() || 'none';
                  const SortIcon = sortIcon[sorted];
                  const title = flexRender(header.column.columnDef.header, header.getContext());
                  if (!header.column.getCanSort()) {
                    return (
                      <th key={header.id} scope="col" className="px-2 py-1 font-semibold">
                        {title}
                      </th>
                    );
                  }
                  return (
                    <th key={header.id} scope="col" aria-sort={sorted === 'none' ? 'none' : `${sorted}ending`} className="px-2 py-1 font-semibold">
                      <button type="button" onClick={header.column.getToggleSortingHandler()} className="-mx-2 inline-flex min-h-target items-center gap-1 rounded-md px-2 hover:bg-paper">
                        {title}
                        <SortIcon aria-hidden className={`h-4 w-4 ${sorted === 'none' ? 'text-ink-muted' : ''}`} />
                      </button>
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => {
              const needsAttention = row.original.attention.length > 0;
              return (
                <tr
                  key={row.id}
                  data-attention={needsAttention || undefined}
                  // The tint and the bar repeat the words in the Needs attention column; they never stand alone.
                  className={`border-t border-ink/10 ${needsAttention ? 'bg-ember-50/60 shadow-[inset_4px_0_0_#c4521f]' : ''}`}
                >
                  {row.getVisibleCells().map((cell) => (
                    <td key={cell.id} className="px-2 py-2 align-top">
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </td>
                  ))}
                </tr>
              );
            })}
            {runs.data && runs.data.items.length === 0 ? (
              <tr>
                <td colSpan={columns.length} className="px-4 py-6 text-center text-ink-muted">
                  No runs match these filters.
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>

      <Pager page={query.page} pageCount={table.getPageCount()} onPage={(page) => table.setPageIndex(page - 1)} />
    </section>
  );
}
