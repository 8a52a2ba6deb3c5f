import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AuditFilters } from '../../../../shared/audit/responses';
import { apiRequest } from '../../../lib/api-client';
import { auditKeys } from './keys';

export const getAuditFilters = () => apiRequest<AuditFilters>('/api/audit/filters');

export const getAuditFiltersQueryOptions = () => queryOptions({ queryKey: auditKeys.filters(), queryFn: getAuditFilters });

export const useAuditFilters = () => useQuery(getAuditFiltersQueryOptions());
