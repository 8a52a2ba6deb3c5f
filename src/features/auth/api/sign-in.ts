import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SessionUser, SignInInput } from '../../../../shared/auth/schemas';
import { apiRequest, forgetCsrfToken } from '../../../lib/api-client';
import { authKeys } from './get-me';

export async function signIn(input: SignInInput): Promise<SessionUser> {
  const { user } = await apiRequest<{ user: SessionUser }>('/api/auth/login', { method: 'POST', body: input });
  forgetCsrfToken();
  return user;
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (user) => {
      queryClient.setQueryData(authKeys.me, user);
    },
  });
}
