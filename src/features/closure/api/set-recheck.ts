import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { InjuryView } from '../../../../shared/records/responses';
import { apiRequest } from '../../../lib/api-client';
import { closureKeys } from './keys';

export const setRecheck = (injuryId: string, nextRecheckAt: string | null) =>
  apiRequest<{ injury: InjuryView }>(`/api/injuries/${encodeURIComponent(injuryId)}/recheck`, { method: 'PUT', body: { nextRecheckAt } }).then((r) => r.injury);

export function useSetRecheck(injuryId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (nextRecheckAt: string | null) => setRecheck(injuryId, nextRecheckAt),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: closureKeys.injuries }),
  });
}
