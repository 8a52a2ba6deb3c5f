import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { AthleteListQuery } from '../../../../shared/records/athlete';
import type { AthleteView, Paged } from '../../../../shared/records/responses';
import { apiRequest } from '../../../lib/api-client';
import { athleteKeys } from './keys';

export function getAthletes(query: AthleteListQuery, signal?: AbortSignal) {
  const params = new URLSearchParams({ sort: query.sort, direction: query.direction, page: String(query.page), pageSize: String(query.pageSize) });
  if (query.q) params.set('q', query.q);
  return apiRequest<Paged<AthleteView>>(`/api/athletes?${params}`, { signal });
}

export const getAthletesQueryOptions = (query: AthleteListQuery) =>
  queryOptions({
    queryKey: athleteKeys.list(query),
    queryFn: ({ signal }) => getAthletes(query, signal),
    // The last page stays on screen while the next search or page loads, so the table does not jump.
    placeholderData: keepPreviousData,
  });

export const useAthletes = (query: AthleteListQuery) => useQuery(getAthletesQueryOptions(query));
