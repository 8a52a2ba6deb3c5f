import { useMutation } from '@tanstack/react-query';
import type { OptOutResult } from '../../../../shared/data-rights/opt-out';
import { apiRequest } from '../../../lib/api-client';

export const confirmOptOut = (token: string) => apiRequest<OptOutResult>('/api/opt-out', { method: 'POST', body: { token } });

export const useConfirmOptOut = () => useMutation({ mutationFn: confirmOptOut });
