import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/api-client';
import { reviewRunsSearch, type ReviewRunsQuery } from '../lib/review-query';
import { reviewKeys } from './keys';
import type { ReviewRunsPage } from '../../../../shared/review/responses';

export const getReviewRuns = (query: ReviewRunsQuery) => apiRequest<ReviewRunsPage>(`/api/review/runs?${reviewRunsSearch(query)}`);

export const getReviewRunsQueryOptions = (query: ReviewRunsQuery) =>
  queryOptions({
    queryKey: reviewKeys.runList(query),
    queryFn: () => getReviewRuns(query),
    // The previous page stays on screen while the next one loads, so the table does not jump.
    placeholderData: keepPreviousData,
  });

export const useReviewRuns = (query: ReviewRunsQuery) => useQuery(getReviewRunsQueryOptions(query));
