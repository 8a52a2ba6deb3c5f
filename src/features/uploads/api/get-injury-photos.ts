import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PhotoView } from '../../../../shared/uploads/uploads';
import { apiRequest } from '../../../lib/api-client';
import { uploadKeys } from './keys';

export const getInjuryPhotos = (injuryId: string) =>
  apiRequest<{ items: PhotoView[] }>(`/api/injuries/${encodeURIComponent(injuryId)}/photos`).then((r) => r.items);

export const getInjuryPhotosQueryOptions = (injuryId: string) => queryOptions({ queryKey: uploadKeys.injuryPhotos(injuryId), queryFn: () => getInjuryPhotos(injuryId) });

export const useInjuryPhotos = (injuryId: string) => useQuery(getInjuryPhotosQueryOptions(injuryId));
