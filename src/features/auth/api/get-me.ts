import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SessionUser } from '../../../../shared/auth/schemas';
import { ApiError, apiRequest } from '../../../lib/api-client';

export const authKeys = { me: ['auth', 'me'] as const };

/** The signed-in user, or null when signed out (401 is an answer here, not an error). */
export async function getMe(): Promise<SessionUser | null> {
  try {
    const { user } = await apiRequest<{ user: SessionUser }>('/api/auth/me');
    return user;
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) return null;
    throw error;
  }
}

export const getMeQueryOptions = () => queryOptions({ queryKey: authKeys.me, queryFn: getMe, staleTime: 60_000 });

export const useMe = () => useQuery(getMeQueryOptions());
