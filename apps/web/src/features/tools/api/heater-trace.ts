import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { FiguresToolResponse, HeaterTraceToolBody } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export const heaterTraceKey = (body: HeaterTraceToolBody | null) => [...rootKeys.tools, 'heater-trace', body] as const;
export const computeHeaterTrace = (body: HeaterTraceToolBody, signal?: AbortSignal) => api.post<FiguresToolResponse>('/api/tools/heater-trace', body, { signal });
export const heaterTraceQuery = (body: HeaterTraceToolBody | null) =>
  queryOptions({
    queryKey: heaterTraceKey(body),
    queryFn: ({ signal }) => computeHeaterTrace(body as HeaterTraceToolBody, signal),
    enabled: body !== null,
    placeholderData: keepPreviousData,
    staleTime: Infinity,
  });
/** Heater-trace figures from the server; null body = not enough typed yet. */
export const useHeaterTrace = (body: HeaterTraceToolBody | null) => useQuery(heaterTraceQuery(body));
