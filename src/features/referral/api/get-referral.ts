import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ReferralSummary } from '../../../../shared/clinic/referral';
import { apiRequest } from '../../../lib/api-client';

export const referralKeys = {
  all: ['injuries', 'referral'] as const,
  detail: (injuryId: string, runId: string | null) => [...referralKeys.all, injuryId, runId ?? 'latest'] as const,
};

export const getReferral = (injuryId: string, runId: string | null) =>
  apiRequest<{ referral: ReferralSummary }>(`/api/injuries/${encodeURIComponent(injuryId)}/referral${runId ? `?runId=${encodeURIComponent(runId)}` : ''}`).then((r) => r.referral);

// Each opening is a fresh summary (and a fresh line in the audit trail): never served from an old cache.
export const getReferralQueryOptions = (injuryId: string, runId: string | null) =>
  queryOptions({ queryKey: referralKeys.detail(injuryId, runId), queryFn: () => getReferral(injuryId, runId), staleTime: 0, gcTime: 0, refetchOnWindowFocus: false });

export const useReferral = (injuryId: string, runId: string | null) => useQuery(getReferralQueryOptions(injuryId, runId));
