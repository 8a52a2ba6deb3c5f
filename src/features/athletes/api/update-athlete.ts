import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AthleteUpdate } from '../../../../shared/records/athlete';
import type { AthleteView } from '../../../../shared/records/responses';
import { apiRequest } from '../../../lib/api-client';
import type { AthleteDetail } from './get-athlete';
import { athleteKeys } from './keys';

export const updateAthlete = (id: string, input: AthleteUpdate) =>
  apiRequest<{ athlete: AthleteView }>(`/api/athletes/${encodeURIComponent(id)}`, { method: 'PATCH', body: input }).then((r) => r.athlete);

export function useUpdateAthlete(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: AthleteUpdate) => updateAthlete(id, input),
    onSuccess: (athlete) => {
      queryClient.setQueryData<AthleteDetail>(athleteKeys.detail(id), (old) => (old ? { ...old, athlete } : old));
      return queryClient.invalidateQueries({ queryKey: athleteKeys.lists() });
    },
  });
}
