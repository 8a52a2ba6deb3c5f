import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OptOutLinkInfo } from '../../../../shared/data-rights/opt-out';
import { apiRequest } from '../../../lib/api-client';

export const optOutKeys = { link: (token: string) => ['opt-out', 'link', token] as const };

// A POST, so the token travels in the body rather than in a URL that logs and proxies may keep.
export const checkOptOutLink = (token: string) =>
  apiRequest<{ link: OptOutLinkInfo }>('/api/opt-out/check', { method: 'POST', body: { token } }).then((r) => r.link);

export const getOptOutLinkQueryOptions = (token: string) =>
  queryOptions({ queryKey: optOutKeys.link(token), queryFn: () => checkOptOutLink(token), retry: false, staleTime: Infinity, enabled: token.length > 0 });

export const useOptOutLink = (token: string) => useQuery(getOptOutLinkQueryOptions(token));
