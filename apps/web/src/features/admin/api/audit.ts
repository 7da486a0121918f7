import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AuditEntry } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export const auditKey = (filter: { entityType?: string }) => [...rootKeys.admin, 'audit', filter] as const;
export const getAudit = (filter: { entityType?: string }) => api.get<{ entries: AuditEntry[] }>('/api/audit', { query: { entityType: filter.entityType, limit: 300 } }).then((r) => r.entries);
export const auditQuery = (filter: { entityType?: string } = {}) => queryOptions({ queryKey: auditKey(filter), queryFn: () => getAudit(filter) });
export const useAudit = (filter: { entityType?: string } = {}) => useQuery(auditQuery(filter));
