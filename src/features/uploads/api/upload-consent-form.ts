import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ConsentFormView } from '../../../../shared/uploads/uploads';
import { uploadKeys } from './keys';
import { sendFile } from './send-file';

export const uploadConsentForm = (athleteId: string, file: File) =>
  sendFile<{ consentForm: ConsentFormView }>(`/api/athletes/${encodeURIComponent(athleteId)}/consent-form`, file).then((r) => r.consentForm);

export function useUploadConsentForm(athleteId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => uploadConsentForm(athleteId, file),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: uploadKeys.consentForms(athleteId) }),
  });
}
