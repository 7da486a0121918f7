import { queryOptions, useQueries } from '@tanstack/react-query';
import type { RunDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export const runKey = (id: number) => [...rootKeys.runs, id, 'record'] as const;
export const getRun = (id: number) => api.get<{ run: RunDto }>(`/api/runs/${id}`).then((r) => r.run);
export const runQuery = (id: number) => queryOptions({ queryKey: runKey(id), queryFn: () => getRun(id) });
/** Several runs at once (an overlay may mix teardowns). */
export const useRuns = (ids: number[]) => useQueries({ queries: ids.map((id) => runQuery(id)) });
