import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { auditSearch, type AuditQuery } from '../../../../shared/audit/query';
import type { AuditPage } from '../../../../shared/audit/responses';
import { apiRequest } from '../../../lib/api-client';
import { auditKeys } from './keys';

export const getAuditEvents = (query: AuditQuery) => apiRequest<AuditPage>(`/api/audit/events?${auditSearch(query)}`);

export const getAuditEventsQueryOptions = (query: AuditQuery) =>
  // The previous page stays on screen while the next loads, so the table does not jump.
  queryOptions({ queryKey: auditKeys.events(query), queryFn: () => getAuditEvents(query), placeholderData: keepPreviousData });

export const useAuditEvents = (query: AuditQuery) => useQuery(getAuditEventsQueryOptions(query));

/** The CSV export is a plain download of the same filters (every matching event, not one page). */
export const auditCsvHref = (query: AuditQuery) => {
  const { page: _page, pageSize: _size, ...filters } = query;
  const search = auditSearch(filters);
  return `/api/audit/events.csv${search ? `?${search}` : ''}`;
};
