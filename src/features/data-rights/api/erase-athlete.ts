import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { EraseAthleteInput, ErasureResult } from '../../../../shared/data-rights/data-rights';
import { apiRequest } from '../../../lib/api-client';
import { dataRightsKeys } from './search-athletes';

export const eraseAthlete = (id: string, body: EraseAthleteInput) =>
  apiRequest<ErasureResult>(`/api/athletes/${encodeURIComponent(id)}/erase`, { method: 'POST', body });

export function useEraseAthlete() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: EraseAthleteInput }) => eraseAthlete(id, body),
    // Other screens hold the athlete too (the register, their page): every cached view of them is stale now.
    onSuccess: () => Promise.all([queryClient.invalidateQueries({ queryKey: dataRightsKeys.all }), queryClient.invalidateQueries({ queryKey: ['athletes'] })]),
  });
}
