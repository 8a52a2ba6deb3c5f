import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AthleteCreate } from '../../../../shared/records/athlete';
import type { AthleteView } from '../../../../shared/records/responses';
import { apiRequest } from '../../../lib/api-client';
import type { AthleteDetail } from './get-athlete';
import { athleteKeys } from './keys';

export const createAthlete = (input: AthleteCreate) =>
  apiRequest<{ athlete: AthleteView }>('/api/athletes', { method: 'POST', body: input }).then((r) => r.athlete);

export function useCreateAthlete() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createAthlete,
    onSuccess: (athlete) => {
      // A new athlete has no injuries yet, so their page can open without a round trip.
      queryClient.setQueryData<AthleteDetail>(athleteKeys.detail(athlete.id), { athlete, injuries: [] });
      return queryClient.invalidateQueries({ queryKey: athleteKeys.lists() });
    },
  });
}
