import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MeasurementCreate } from '../../../../shared/records/measurement';
import type { InjuryView, MeasurementView } from '../../../../shared/records/responses';
import { apiRequest } from '../../../lib/api-client';
import { injuryKeys } from './keys';

export const addMeasurement = (injuryId: string, input: MeasurementCreate) =>
  apiRequest<{ measurement: MeasurementView; injury: InjuryView }>(`/api/injuries/${encodeURIComponent(injuryId)}/measurements`, {
    method: 'POST',
    body: input,
  });

export function useAddMeasurement(injuryId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: MeasurementCreate) => addMeasurement(injuryId, input),
    // A new reading can change the grade, the phase, the pad and the skinfold's cold figures: refetch them all.
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: injuryKeys.detail(injuryId) }),
        queryClient.invalidateQueries({ queryKey: injuryKeys.lists() }),
      ]),
  });
}
