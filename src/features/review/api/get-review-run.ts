import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/api-client';
import { reviewKeys } from './keys';
import type { ReviewRunDetail } from '../../../../shared/review/responses';

export const getReviewRun = (id: string) => apiRequest<ReviewRunDetail>(`/api/review/runs/${encodeURIComponent(id)}`);

export const getReviewRunQueryOptions = (id: string) => queryOptions({ queryKey: reviewKeys.run(id), queryFn: () => getReviewRun(id) });

export const useReviewRun = (id: string) => useQuery(getReviewRunQueryOptions(id));
