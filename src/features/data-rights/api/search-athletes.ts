import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { DataRightsAthlete } from '../../../../shared/data-rights/data-rights';
import { apiRequest } from '../../../lib/api-client';

export const dataRightsKeys = {
  all: ['data-rights'] as const,
  search: (q: string) => [...dataRightsKeys.all, 'athletes', q] as const,
};

export const searchDataRightsAthletes = (q: string) =>
  apiRequest<{ items: DataRightsAthlete[] }>(`/api/data-rights/athletes${q ? `?q=${encodeURIComponent(q)}` : ''}`).then((r) => r.items);

export const getDataRightsAthletesQueryOptions = (q: string) =>
  queryOptions({ queryKey: dataRightsKeys.search(q), queryFn: () => searchDataRightsAthletes(q), placeholderData: keepPreviousData });

export const useDataRightsAthletes = (q: string) => useQuery(getDataRightsAthletesQueryOptions(q));

/** The zip is a plain download: the browser saves it with the name the server gives. */
export const athleteExportUrl = (id: string) => `/api/athletes/${encodeURIComponent(id)}/export`;
