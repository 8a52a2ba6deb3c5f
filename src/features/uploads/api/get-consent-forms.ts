import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ConsentFormView } from '../../../../shared/uploads/uploads';
import { apiRequest } from '../../../lib/api-client';
import { uploadKeys } from './keys';

export const getConsentForms = (athleteId: string) =>
  apiRequest<{ items: ConsentFormView[] }>(`/api/athletes/${encodeURIComponent(athleteId)}/consent-forms`).then((r) => r.items);

export const getConsentFormsQueryOptions = (athleteId: string) => queryOptions({ queryKey: uploadKeys.consentForms(athleteId), queryFn: () => getConsentForms(athleteId) });

export const useConsentForms = (athleteId: string) => useQuery(getConsentFormsQueryOptions(athleteId));
