import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/api-client';
import { reviewKeys } from './keys';
import type { AdherenceReport } from '../../../../shared/review/responses';

export function getAdherence(range: { from?: string; to?: string }) {
  const search = new URLSearchParams();
  if (range.from) search.set('from', range.from);
  if (range.to) search.set('to', range.to);
  const text = search.toString();
  return apiRequest<AdherenceReport>(`/api/review/adherence${text ? `?${text}` : ''}`);
}

export const getAdherenceQueryOptions = (range: { from?: string; to?: string }) =>
  queryOptions({ queryKey: reviewKeys.adherence(range), queryFn: () => getAdherence(range), placeholderData: keepPreviousData });

export const useAdherence = (range: { from?: string; to?: string }) => useQuery(getAdherenceQueryOptions(range));
