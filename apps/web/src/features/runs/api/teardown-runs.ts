import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RunDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const teardownRunsKey = (teardownId: number) => [...teardownScope(teardownId), 'runs'] as const;
export const getTeardownRuns = (teardownId: number) => api.get<{ runs: RunDto[] }>(`/api/teardowns/${teardownId}/runs`).then((r) => r.runs);
export const teardownRunsQuery = (teardownId: number) => queryOptions({ queryKey: teardownRunsKey(teardownId), queryFn: () => getTeardownRuns(teardownId) });
export const useTeardownRuns = (teardownId: number) => useQuery(teardownRunsQuery(teardownId));
