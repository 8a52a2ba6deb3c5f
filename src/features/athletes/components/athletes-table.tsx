import { useEffect, useRef, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { createColumnHelper, flexRender, getCoreRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { ArrowDown, ArrowUp, ArrowUpDown } from 'lucide-react';
import { athleteSortFields, type AthleteListQuery } from '../../../../shared/records/athlete';
import type { AthleteView } from '../../../../shared/records/responses';
import { Pager } from '../../../components/ui/pager';
import { TextField } from '../../../components/ui/text-field';
import { useAthletes } from '../api/get-athletes';

type SortField = (typeof athleteSortFields)[number];
const pageSize = 20;
const searchDelayMs = 300;

const column = createColumnHelper<AthleteView>();
const dateOnly = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });

const columns = [
  column.accessor('name', {
    id: 'name',
    header: 'Name',
    cell: (c) => (
      <Link to={`/athletes/${c.row.original.id}`} className="inline-flex min-h-target items-center font-semibold underline decoration-ink/30 underline-offset-4">
        {c.getValue()}
      </Link>
    ),
  }),
  column.accessor('yearOfBirth', { id: 'yearOfBirth', header: 'Year of birth' }),
  column.accessor('sport', { header: 'Sport', enableSorting: false }),
  column.accessor('position', { header: 'Position', enableSorting: false, cell: (c) => c.getValue() ?? '—' }),
  column.accessor('openInjuries', { header: 'Open injuries', enableSorting: false, cell: (c) => c.getValue() ?? 0 }),
  column.accessor('consentToTreatment', { header: 'Consent', enableSorting: false, cell: (c) => (c.getValue() ? 'Recorded' : 'Not recorded') }),
  column.accessor('createdAt', { id: 'createdAt', header: 'Added', cell: (c) => dateOnly.format(new Date(c.getValue())) }),
];

const isSortField = (value: string | null): value is SortField => (athleteSortFields as readonly string[]).includes(value ?? '');

/** Search, sort and page live in the address, so Back from an athlete returns to the same view. */
function useListQuery(): [AthleteListQuery, (next: Partial<AthleteListQuery>) => void] {
  const [params, setParams] = useSearchParams();
  const sort = params.get('sort');
  const query: AthleteListQuery = {
    q: params.get('q') ?? undefined,
    sort: isSortField(sort) ? sort : 'name',
    direction: params.get('direction') === 'desc' ? 'desc' : 'asc',
    page: Math.max(1, Number(params.get('page')) || 1),
    pageSize,
  };
  const update = (next: Partial<AthleteListQuery>) => {
    const merged = { ...query, ...next };
    setParams(
      (current) => {
        const out = new URLSearchParams(current);
        for (const [key, value] of Object.entries({ q: merged.q, sort: merged.sort, direction: merged.direction, page: String(merged.page) })) {
          if (value) out.set(key, value);
          else out.delete(key);
        }
        return out;
      },
      { replace: true },
    );
  };
  return [query, update];
}

export function AthletesTable() {
  const [query, setQuery] = useListQuery();
  const [search, setSearch] = useState(query.q ?? '');
  const athletes = useAthletes(query);
  const setQueryRef = useRef(setQuery);
  setQueryRef.current = setQuery;

  // The server is asked once typing pauses, not on every key.
  useEffect(() => {
    const trimmed = search.trim();
    if (trimmed === (query.q ?? '')) return;
    const timer = setTimeout(() => setQueryRef.current({ q: trimmed || undefined, page: 1 }), searchDelayMs);
    return () => clearTimeout(timer);
  }, [search, query.q]);

  const sorting: SortingState = [{ id: query.sort, desc: query.direction === 'desc' }];
  const table = useReactTable({
    data: athletes.data?.items ?? [],
    columns,
    state: { sorting },
    manualSorting: true,
    manualPagination: true,
    enableSortingRemoval: false,
    enableMultiSort: false,
    rowCount: athletes.data?.total ?? 0,
    onSortingChange: (updater) => {
      const next = (typeof updater === 'function' ? updater(sorting) : updater)[0];
      if (next && isSortField(next.id)) setQuery({ sort: next.id, direction: next.desc ? 'desc' : 'asc', page: 1 });
    },
    getCoreRowModel: getCoreRowModel(),
  });

  const total = athletes.data?.total ?? 0;
  const pages = Math.max(1, Math.ceil(total / pageSize));

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-3">
        <TextField
          label="Search athletes"
          type="search"
          hint="Name, sport or position"
          value={search}
          onChange={(event) => setSearch(event.target.value)}
          className="w-full max-w-md"
        />
        <p className="pb-7 text-sm text-ink-muted" role="status" aria-live="polite">
          {athletes.isPending ? 'Loading…' : `${total} ${total === 1 ? 'athlete' : 'athletes'}${query.q ? ` matching “${query.q}”` : ''}`}
          {athletes.isFetching && !athletes.isPending ? ' · updating…' : ''}
        </p>
      </div>

      {athletes.isError ? <p className="text-ember-700">{athletes.error.message}</p> : null}

      <div className="overflow-x-auto rounded-xl bg-paper-raised ring-1 ring-ink/10">
        <table className="w-full text-left">
          <caption className="sr-only">Athletes of your clinic; sortable columns have buttons in their headings</caption>
          <thead className="bg-paper-sunk text-sm">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  const label = flexRender(header.column.columnDef.header, header.getContext());
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : header.column.getCanSort() ? 'none' : undefined}
                      className="px-4 py-1 font-semibold"
                    >
                      {header.column.getCanSort() ? (
                        <button
                          type="button"
                          onClick={header.column.getToggleSortingHandler()}
                          className="-mx-2 inline-flex min-h-target items-center gap-1 rounded-md px-2 hover:bg-paper"
                        >
                          {label}
                          {sorted === 'asc' ? <ArrowUp aria-hidden className="h-4 w-4" /> : sorted === 'desc' ? <ArrowDown aria-hidden className="h-4 w-4" /> : <ArrowUpDown aria-hidden className="h-4 w-4 text-ink-muted" />}
                        </button>
                      ) : (
                        label
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="border-t border-ink/10">
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-4 py-1">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
            {athletes.isSuccess && total === 0 ? (
              <tr>
                <td colSpan={columns.length} className="px-4 py-6 text-center text-ink-muted">
                  {query.q ? 'No athlete matches that search.' : 'No athletes registered yet. Add the first one above.'}
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>

      <Pager page={query.page} pageCount={pages} onPage={(page) => setQuery({ page })} />
    </div>
  );
}
