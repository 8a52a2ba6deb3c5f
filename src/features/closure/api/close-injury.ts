import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { InjuryClose } from '../../../../shared/records/injury';
import type { InjuryView } from '../../../../shared/records/responses';
import { apiRequest } from '../../../lib/api-client';
import { closureKeys } from './keys';

export const closeInjury = (injuryId: string, body: InjuryClose) =>
  apiRequest<{ injury: InjuryView }>(`/api/injuries/${encodeURIComponent(injuryId)}/close`, { method: 'POST', body }).then((r) => r.injury);

export function useCloseInjury(injuryId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: InjuryClose) => closeInjury(injuryId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: closureKeys.injuries }),
  });
}
