import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { StaffMember } from '../../../../shared/auth/schemas';
import type { InvitationInput } from '../../../../shared/mail/account-schemas';
import { apiRequest } from '../../../lib/api-client';
import { staffKeys } from './get-staff';

export type InvitationAnswer = { member: StaffMember; expiresAt: string };

export const inviteStaff = (body: InvitationInput) => apiRequest<InvitationAnswer>('/api/staff/invitations', { method: 'POST', body });

export function useInviteStaff() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: inviteStaff,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: staffKeys.all }),
  });
}
