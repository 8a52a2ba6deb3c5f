import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/api-client';
import { staffKeys } from './get-staff';
import type { InvitationAnswer } from './invite-staff';

/** A fresh link for someone invited who has not set a password yet; the earlier links stop working. */
export const resendInvitation = (id: string) => apiRequest<InvitationAnswer>(`/api/staff/${encodeURIComponent(id)}/invitation`, { method: 'POST' });

export function useResendInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: resendInvitation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: staffKeys.all }),
  });
}
