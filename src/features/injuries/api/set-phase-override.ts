import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PhaseOverride } from '../../../../shared/records/injury';
import type { InjuryView } from '../../../../shared/records/responses';
import { apiRequest } from '../../../lib/api-client';
import { injuryKeys } from './keys';

/** `null` clears the override and the suggested phase applies again. */
export const setPhaseOverride = (injuryId: string, override: PhaseOverride | null) =>
  apiRequest<{ injury: InjuryView }>(`/api/injuries/${encodeURIComponent(injuryId)}/phase-override`, {
    method: 'PUT',
    body: { override },
  }).then((r) => r.injury);

export function useSetPhaseOverride(injuryId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (override: PhaseOverride | null) => setPhaseOverride(injuryId, override),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: injuryKeys.detail(injuryId) }),
        queryClient.invalidateQueries({ queryKey: injuryKeys.lists() }),
      ]),
  });
}
