import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/api-client';
import { reviewKeys } from './keys';
import type { ReviewFilterOptions } from '../../../../shared/review/responses';

export const getReviewFilters = () => apiRequest<ReviewFilterOptions>('/api/review/filters');

export const getReviewFiltersQueryOptions = () => queryOptions({ queryKey: reviewKeys.filters(), queryFn: getReviewFilters, staleTime: 5 * 60_000 });

export const useReviewFilters = () => useQuery(getReviewFiltersQueryOptions());
