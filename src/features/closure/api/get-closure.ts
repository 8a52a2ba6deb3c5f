import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ClosureView } from '../../../../shared/clinic/closure';
import { apiRequest } from '../../../lib/api-client';
import { closureKeys } from './keys';

export const getClosure = (injuryId: string) => apiRequest<ClosureView>(`/api/injuries/${encodeURIComponent(injuryId)}/closure`);

// The check reads the latest measurement, which may have been added a moment ago on the same page.
export const getClosureQueryOptions = (injuryId: string) => queryOptions({ queryKey: closureKeys.closure(injuryId), queryFn: () => getClosure(injuryId), staleTime: 0 });

export const useClosure = (injuryId: string) => useQuery(getClosureQueryOptions(injuryId));
