import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { StaffMember } from '../../../../shared/auth/schemas';
import type { StaffUpdate } from '../../../../shared/staff/schemas';
import { apiRequest } from '../../../lib/api-client';
import { staffKeys } from './get-staff';

export const updateStaffMember = (id: string, body: StaffUpdate) =>
  apiRequest<{ member: StaffMember }>(`/api/staff/${encodeURIComponent(id)}`, { method: 'PATCH', body }).then((r) => r.member);

export function useUpdateStaffMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: StaffUpdate }) => updateStaffMember(id, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: staffKeys.all }),
  });
}
