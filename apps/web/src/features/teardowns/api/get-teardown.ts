import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TeardownDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';

import { teardownScope } from '@/lib/query-keys';

export const teardownKey = (id: number) => [...teardownScope(id), 'record'] as const;
export const getTeardown = (id: number) => api.get<{ teardown: TeardownDto }>(`/api/teardowns/${id}`).then((r) => r.teardown);
export const teardownQuery = (id: number) => queryOptions({ queryKey: teardownKey(id), queryFn: () => getTeardown(id) });
export const useTeardown = (id: number) => useQuery(teardownQuery(id));
