import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Reinjury } from '../../../../shared/records/injury';
import type { InjuryView } from '../../../../shared/records/responses';
import { apiRequest } from '../../../lib/api-client';
import { closureKeys } from './keys';

export const recordReinjury = (injuryId: string, body: Reinjury) =>
  apiRequest<{ injury: InjuryView }>(`/api/injuries/${encodeURIComponent(injuryId)}/reinjury`, { method: 'POST', body }).then((r) => r.injury);

export function useRecordReinjury(injuryId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: Reinjury) => recordReinjury(injuryId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: closureKeys.injuries }),
  });
}
