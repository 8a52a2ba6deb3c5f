import { queryOptions, useQuery } from '@tanstack/react-query';
import type { InjuryDetailView } from '../../../../shared/records/responses';
import { apiRequest } from '../../../lib/api-client';
import { injuryKeys } from './keys';

export const getInjury = (id: string) => apiRequest<InjuryDetailView>(`/api/injuries/${encodeURIComponent(id)}`);

// Days since injury, the cold schedule and "re-measure due" move with the clock, so a revisit refetches.
export const getInjuryQueryOptions = (id: string) => queryOptions({ queryKey: injuryKeys.detail(id), queryFn: () => getInjury(id), staleTime: 0 });

export const useInjury = (id: string) => useQuery(getInjuryQueryOptions(id));
