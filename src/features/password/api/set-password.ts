import { useMutation } from '@tanstack/react-query';
import type { LinkPurpose, SetPasswordInput } from '../../../../shared/mail/account-schemas';
import { apiRequest } from '../../../lib/api-client';

export const setPassword = (input: SetPasswordInput) =>
  apiRequest<{ ok: true; purpose: LinkPurpose; email: string }>('/api/auth/password', { method: 'POST', body: input });

export const useSetPassword = () => useMutation({ mutationFn: setPassword });
