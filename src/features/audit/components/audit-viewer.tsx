import { useSearchParams } from 'react-router-dom';
import { ChevronLeft, ChevronRight, Download, X } from 'lucide-react';
import { auditQuerySchema, type AuditQuery } from '../../../../shared/audit/query';
import { recordTypeWords, type AuditEventView } from '../../../../shared/audit/responses';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { auditCsvHref, useAuditEvents } from '../api/get-audit-events';
import { useAuditFilters } from '../api/get-audit-filters';
import { FilterSelect } from '../../../components/ui/filter-select';

const filterKeys = ['userId', 'recordType', 'from', 'to'] as const;

/** The address bar holds the filters; a hand-edited address that does not parse falls back to the first page of everything. */
function parseQuery(params: URLSearchParams): AuditQuery {
  const parsed = auditQuerySchema.safeParse(Object.fromEntries(params));
  return parsed.success ? parsed.data : auditQuerySchema.parse({});
}

function toParams(query: Partial<AuditQuery>): URLSearchParams {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value !== undefined && value !== '' && !(key === 'page' && value === 1) && !(key === 'pageSize' && value === 50)) params.set(key, String(value));
  }
  return params;
}

/** "settings.updated" → "Settings updated"; the trail's action names are ours, so words are derived from them. */
export function actionWords(action: string): string {
  const text = action.replace(/[.-]/g, ' ');
  return text.charAt(0).toUpperCase() + text.slice(1);
}

function detailText(detail: Record<string, unknown>): string {
  const changed = detail.changed as Record<string, { from: unknown; to: unknown }> | undefined;
  if (changed && typeof changed === 'object') {
    return Object.entries(changed)
      .map(([key, { from, to }]) => `${key}: ${JSON.stringify(from)} → ${JSON.stringify(to)}`)
      .join('; ');
  }
  return Object.entries(detail)
    .filter(([, value]) => value !== null && value !== undefined && !(Array.isArray(value) && value.length === 0))
    .map(([key, value]) => `${key}: ${typeof value === 'string' ? value : JSON.stringify(value)}`)
    .join('; ');
}

export function AuditViewer() {
  const [params, setParams] = useSearchParams();
  const query = parseQuery(params);
  const events = useAuditEvents(query);
  const filters = useAuditFilters();
  const change = (next: Partial<AuditQuery>, keepPage = false) => setParams(toParams({ ...query, ...(keepPage ? {} : { page: 1 }), ...next }), { replace: true });
  const anyFilter = filterKeys.some((key) => query[key] !== undefined);
  const timeZone = filters.data?.timeZone;
  const when = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'medium', timeZone });
  const pages = events.data ? Math.max(1, Math.ceil(events.data.total / events.data.pageSize)) : 1;

  return (
    <div className="flex flex-col gap-4">
      <form role="search" aria-label="Filter the audit trail" onSubmit={(e) => e.preventDefault()} className="grid gap-3 rounded-xl bg-paper-raised p-4 ring-1 ring-ink/10 sm:grid-cols-2 lg:grid-cols-6">
        <FilterSelect label="Person" value={query.userId} onChange={(userId) => change({ userId })}>
          <option value="">Everyone</option>
          {filters.data?.people.map((p) => (
            <option key={p.id} value={p.id}>
              {p.name}
              {p.active ? '' : ' (deactivated)'}
            </option>
          ))}
        </FilterSelect>
        <FilterSelect label="Record type" value={query.recordType} onChange={(recordType) => change({ recordType })}>
          <option value="">All records</option>
          {filters.data?.recordTypes.map((type) => (
            <option key={type} value={type}>
              {recordTypeWords[type] ?? type}
            </option>
          ))}
        </FilterSelect>
        <TextField label="From" type="date" value={query.from ?? ''} max={query.to} onChange={(e) => change({ from: e.target.value || undefined })} />
        <TextField label="To" type="date" value={query.to ?? ''} min={query.from} onChange={(e) => change({ to: e.target.value || undefined })} />
        <div className="flex items-end">
          <Button variant="ghost" disabled={!anyFilter} onClick={() => change({ userId: undefined, recordType: undefined, from: undefined, to: undefined })}>
            <X aria-hidden className="h-4 w-4" /> Clear filters
          </Button>
        </div>
        <div className="flex items-end">
          <a
            href={auditCsvHref(query)}
            download
            className="inline-flex min-h-target items-center justify-center gap-2 rounded-lg border border-ink/25 bg-paper-raised px-4 py-2 font-medium hover:bg-paper-sunk"
          >
            <Download aria-hidden className="h-4 w-4" /> Export CSV
          </a>
        </div>
      </form>

      <p role="status" className="text-ink-soft">
        {events.isPending ? 'Loading the audit trail…' : events.data ? `${events.data.total} ${events.data.total === 1 ? 'event' : 'events'}${timeZone ? ` · times in ${timeZone}` : ''}` : ''}
      </p>
      {events.isError ? <p className="text-ember-700">{events.error.message}</p> : null}

      {events.data ? (
        <div className="overflow-x-auto rounded-xl bg-paper-raised ring-1 ring-ink/10">
          <table className="w-full text-left text-sm">
            <caption className="sr-only">Audit events, newest first</caption>
            <thead className="bg-paper-sunk">
              <tr>
                <th scope="col" className="px-3 py-2 font-semibold">Time</th>
                <th scope="col" className="px-3 py-2 font-semibold">Person</th>
                <th scope="col" className="px-3 py-2 font-semibold">What</th>
                <th scope="col" className="px-3 py-2 font-semibold">Record</th>
                <th scope="col" className="px-3 py-2 font-semibold">Detail</th>
              </tr>
            </thead>
            <tbody>
              {events.data.items.map((event: AuditEventView) => (
                <tr key={event.id} className="border-t border-ink/10 align-top">
                  <td className="whitespace-nowrap px-3 py-2">{when.format(new Date(event.at))}</td>
                  <td className="px-3 py-2">{event.userName ?? '—'}</td>
                  <td className="px-3 py-2 font-medium">{actionWords(event.action)}</td>
                  <td className="px-3 py-2">
                    {recordTypeWords[event.recordType] ?? event.recordType}
                    {event.recordId ? <span className="block font-mono text-xs text-ink-muted">{event.recordId.slice(0, 8)}</span> : null}
                  </td>
                  <td className="max-w-md break-words px-3 py-2 text-ink-soft">{detailText(event.detail)}</td>
                </tr>
              ))}
              {events.data.items.length === 0 ? (
                <tr>
                  <td colSpan={5} className="px-3 py-6 text-center text-ink-muted">
                    No events match these filters.
                  </td>
                </tr>
              ) : null}
            </tbody>
          </table>
        </div>
      ) : null}

      {events.data && pages > 1 ? (
        <nav aria-label="Pages" className="flex items-center gap-3">
          <Button variant="secondary" disabled={query.page <= 1} onClick={() => change({ page: query.page - 1 }, true)}>
            <ChevronLeft aria-hidden className="h-4 w-4" /> Newer
          </Button>
          <span>
            Page {query.page} of {pages}
          </span>
          <Button variant="secondary" disabled={query.page >= pages} onClick={() => change({ page: query.page + 1 }, true)}>
            Older <ChevronRight aria-hidden className="h-4 w-4" />
          </Button>
        </nav>
      ) : null}
    </div>
  );
}
