import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { InjuryCreate } from '../../../../shared/records/injury';
import type { InjuryView } from '../../../../shared/records/responses';
import { apiRequest } from '../../../lib/api-client';
import { injuryKeys } from './keys';

export const createInjury = (input: InjuryCreate) =>
  apiRequest<{ injury: InjuryView }>('/api/injuries', { method: 'POST', body: input }).then((r) => r.injury);

export function useCreateInjury() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createInjury,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: injuryKeys.lists() }),
  });
}
