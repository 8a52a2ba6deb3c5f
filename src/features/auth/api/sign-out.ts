import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest, forgetCsrfToken } from '../../../lib/api-client';
import { authKeys } from './get-me';

export async function signOut(): Promise<void> {
  await apiRequest<void>('/api/auth/logout', { method: 'POST' });
  forgetCsrfToken();
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      queryClient.clear();
      queryClient.setQueryData(authKeys.me, null);
    },
  });
}
