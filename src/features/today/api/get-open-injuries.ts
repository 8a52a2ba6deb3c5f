import { queryOptions, useQuery } from '@tanstack/react-query';
import type { InjuryView } from '../../../../shared/records/responses';
import { apiRequest } from '../../../lib/api-client';

/*
 * The same key hierarchy as the injuries feature's lists (['injuries', 'list', filters]), so recording an
 * injury or a measurement anywhere refreshes Today without the features importing each other.
 */
const openInjuriesKey = ['injuries', 'list', { status: 'open' }] as const;

export const getOpenInjuries = () => apiRequest<{ items: InjuryView[] }>('/api/injuries?status=open').then((r) => r.items);

// Days since injury and "re-measure due" move with the clock: refetch when the therapist comes back.
export const getOpenInjuriesQueryOptions = () => queryOptions({ queryKey: openInjuriesKey, queryFn: getOpenInjuries, staleTime: 0 });

export const useOpenInjuries = () => useQuery(getOpenInjuriesQueryOptions());
