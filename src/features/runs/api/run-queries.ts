import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { RunDetailView, RunView } from '../../../../shared/runs/responses';
import type { ScreeningInput } from '../../../../shared/runs/screening';
import { apiRequest } from '../../../lib/api-client';

export const runKeys = {
  all: ['runs'] as const,
  detail: (id: string) => [...runKeys.all, 'detail', id] as const,
  forInjury: (injuryId: string) => [...runKeys.all, 'list', { injuryId }] as const,
};

export const getRun = (id: string) => apiRequest<RunDetailView>(`/api/runs/${id}`);

export const getRunQueryOptions = (id: string) => queryOptions({ queryKey: runKeys.detail(id), queryFn: () => getRun(id) });

export const useRun = (id: string) => useQuery(getRunQueryOptions(id));

export const getRunsForInjuryQueryOptions = (injuryId: string) =>
  queryOptions({
    queryKey: runKeys.forInjury(injuryId),
    queryFn: () => apiRequest<{ items: RunView[] }>(`/api/runs?injuryId=${injuryId}`).then((r) => r.items),
  });

export const createRun = (injuryId: string) => apiRequest<{ run: RunView }>('/api/runs', { method: 'POST', body: { injuryId } }).then((r) => r.run);

export function useSubmitScreening(runId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (screening: ScreeningInput) =>
      apiRequest<{ run: RunView }>(`/api/runs/${runId}/screening`, { method: 'PUT', body: { screening } }).then((r) => r.run),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: runKeys.detail(runId) }),
  });
}
