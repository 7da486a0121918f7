import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AuditEntry } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const historyKey = (id: number) => [...teardownScope(id), 'history'] as const;
export const getHistory = (id: number) => api.get<{ entries: AuditEntry[] }>(`/api/teardowns/${id}/history`).then((r) => r.entries);
export const historyQuery = (id: number) => queryOptions({ queryKey: historyKey(id), queryFn: () => getHistory(id) });
export const useHistory = (id: number) => useQuery(historyQuery(id));
