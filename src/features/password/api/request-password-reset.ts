import { useMutation } from '@tanstack/react-query';
import type { PasswordResetRequest } from '../../../../shared/mail/account-schemas';
import { apiRequest } from '../../../lib/api-client';

export const requestPasswordReset = (input: PasswordResetRequest) =>
  apiRequest<{ message: string }>('/api/auth/password-reset', { method: 'POST', body: input });

export const useRequestPasswordReset = () => useMutation({ mutationFn: requestPasswordReset });
