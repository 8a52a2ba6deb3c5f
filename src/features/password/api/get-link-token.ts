import { queryOptions, useQuery } from '@tanstack/react-query';
import type { LinkTokenInfo } from '../../../../shared/mail/account-schemas';
import { apiRequest } from '../../../lib/api-client';

export const passwordKeys = { link: (token: string) => ['password', 'link', token] as const };

// A POST, so the token travels in the body rather than in a URL that logs and proxies may keep.
export const getLinkToken = (token: string) =>
  apiRequest<{ link: LinkTokenInfo }>('/api/auth/password-token', { method: 'POST', body: { token } }).then((r) => r.link);

export const getLinkTokenQueryOptions = (token: string) =>
  queryOptions({ queryKey: passwordKeys.link(token), queryFn: () => getLinkToken(token), retry: false, staleTime: Infinity, enabled: token.length > 0 });

export const useLinkToken = (token: string) => useQuery(getLinkTokenQueryOptions(token));
