import { queryOptions, useQuery } from '@tanstack/react-query';
import type { StaffMember } from '../../../../shared/auth/schemas';
import { apiRequest } from '../../../lib/api-client';

export const staffKeys = { all: ['staff'] as const, list: () => [...staffKeys.all, 'list'] as const };

export const getStaff = () => apiRequest<{ staff: StaffMember[] }>('/api/staff').then((r) => r.staff);

export const getStaffQueryOptions = () => queryOptions({ queryKey: staffKeys.list(), queryFn: getStaff });

export const useStaff = () => useQuery(getStaffQueryOptions());
