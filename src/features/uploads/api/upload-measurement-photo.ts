import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PhotoView } from '../../../../shared/uploads/uploads';
import { uploadKeys } from './keys';
import { sendFile } from './send-file';

export const uploadMeasurementPhoto = (measurementId: string, file: File) =>
  sendFile<{ photo: PhotoView }>(`/api/measurements/${encodeURIComponent(measurementId)}/photos`, file).then((r) => r.photo);

export function useUploadMeasurementPhoto(injuryId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ measurementId, file }: { measurementId: string; file: File }) => uploadMeasurementPhoto(measurementId, file),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: uploadKeys.injuryPhotos(injuryId) }),
  });
}
