import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OutboxMessage } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export const outboxKey = [...rootKeys.admin, 'outbox'] as const;
export const getOutbox = () => api.get<{ enabled: boolean; messages: OutboxMessage[] }>('/api/outbox');
export const outboxQuery = () => queryOptions({ queryKey: outboxKey, queryFn: getOutbox, refetchInterval: 5000 });
export const useOutbox = () => useQuery(outboxQuery());
