import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { MarkingToolBody, MarkingToolResponse } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export const markingKey = (body: MarkingToolBody | null) => [...rootKeys.tools, 'marking', body] as const;
export const decodeMarking = (body: MarkingToolBody, signal?: AbortSignal) => api.post<MarkingToolResponse>('/api/tools/marking', body, { signal });
export const markingQuery = (body: MarkingToolBody | null) =>
  queryOptions({
    queryKey: markingKey(body),
    queryFn: ({ signal }) => decodeMarking(body as MarkingToolBody, signal),
    enabled: body !== null,
    placeholderData: keepPreviousData,
    staleTime: Infinity,
  });
/** Decodes a marking or colour bands; null body = nothing to ask yet. */
export const useMarking = (body: MarkingToolBody | null) => useQuery(markingQuery(body));
