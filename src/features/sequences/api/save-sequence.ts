import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Sequence } from '../../../../shared/plan/sequence';
import type { SequenceView } from '../../../../shared/runs/responses';
import { apiRequest } from '../../../lib/api-client';
import { sequenceKeys } from './keys';

/** Every save is a new version; runs already planned keep the version they were built from. */
export const saveSequence = (sequence: Sequence) => apiRequest<{ sequence: SequenceView }>('/api/sequences', { method: 'PUT', body: sequence }).then((r) => r.sequence);

export function useSaveSequence() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveSequence,
    onSuccess: (saved) => {
      queryClient.setQueryData<SequenceView[]>(sequenceKeys.current(), (items) => items?.map((item) => (item.phase === saved.phase ? saved : item)));
      return queryClient.invalidateQueries({ queryKey: sequenceKeys.current() });
    },
  });
}
