import type { AuditQuery } from '../../../../shared/audit/query';

export const auditKeys = {
  all: ['audit'] as const,
  events: (query: AuditQuery) => [...auditKeys.all, 'events', query] as const,
  filters: () => [...auditKeys.all, 'filters'] as const,
};
