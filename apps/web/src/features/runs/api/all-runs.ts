import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { RunDto, RunKind } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

/** Runs across the teardowns the user may read (for overlays). */
export const allRunsKey = (filter: { kind?: RunKind; q?: string }) => [...rootKeys.runs, 'list', filter] as const;
export const getAllRuns = (filter: { kind?: RunKind; q?: string }) => api.get<{ runs: RunDto[] }>('/api/runs', { query: filter }).then((r) => r.runs);
export const allRunsQuery = (filter: { kind?: RunKind; q?: string }) => queryOptions({ queryKey: allRunsKey(filter), queryFn: () => getAllRuns(filter), placeholderData: keepPreviousData });
export const useAllRuns = (filter: { kind?: RunKind; q?: string }) => useQuery(allRunsQuery(filter));
