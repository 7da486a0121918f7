import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { FiguresToolResponse, RuntimeToolBody } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export const runtimeKey = (body: RuntimeToolBody | null) => [...rootKeys.tools, 'runtime', body] as const;
export const computeRuntime = (body: RuntimeToolBody, signal?: AbortSignal) => api.post<FiguresToolResponse>('/api/tools/runtime', body, { signal });
export const runtimeQuery = (body: RuntimeToolBody | null) =>
  queryOptions({
    queryKey: runtimeKey(body),
    queryFn: ({ signal }) => computeRuntime(body as RuntimeToolBody, signal),
    enabled: body !== null,
    placeholderData: keepPreviousData,
    staleTime: Infinity,
  });
/** Runtime figures from the server; null body = not enough typed yet. */
export const useRuntime = (body: RuntimeToolBody | null) => useQuery(runtimeQuery(body));
