import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { v4 as uuidv4 } from 'uuid';
import type { RunDetailView, RunView } from '../../../../shared/runs/responses';
import type { RunInProgressView } from '../../../../shared/runs/run-progress';
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

export const getRunsInProgressQueryOptions = (injuryId?: string) =>
  queryOptions({
    queryKey: [...runKeys.all, 'in-progress', { injuryId: injuryId ?? null }] as const,
    queryFn: () =>
      apiRequest<{ items: RunInProgressView[] }>(`/api/runs/in-progress${injuryId ? `?injuryId=${encodeURIComponent(injuryId)}` : ''}`).then((r) => r.items),
    // A run in progress moves on by itself: look again every half minute.
    refetchInterval: 30_000,
  });

/** Ends a run from the office (left running on a tablet, or to start afresh), with the reason the log needs. */
export const endRunEarly = (runId: string, reason: string) =>
  apiRequest(`/api/runs/${runId}/log`, {
    method: 'POST',
    headers: { 'Idempotency-Key': uuidv4() },
    body: { type: 'run-ended-early', reason, at: new Date().toISOString() },
  });
