import { keepPreviousData, queryOptions, useQueries } from '@tanstack/react-query';
import type { RunSeries } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export interface SeriesWindow {
  from: number;
  to: number;
}

export const runSeriesKey = (id: number, maxPoints: number, window: SeriesWindow | null) => [...rootKeys.runs, id, 'series', maxPoints, window?.from ?? null, window?.to ?? null] as const;
export const getRunSeries = (id: number, maxPoints: number, window: SeriesWindow | null) => api.get<RunSeries>(`/api/runs/${id}/series`, { query: { maxPoints, from: window?.from, to: window?.to } });
export const runSeriesQuery = (id: number, maxPoints: number, window: SeriesWindow | null) =>
  queryOptions({ queryKey: runSeriesKey(id, maxPoints, window), queryFn: () => getRunSeries(id, maxPoints, window), staleTime: 5 * 60_000, placeholderData: keepPreviousData });
/** The downsampled series of each run, for the same time window. */
export const useRunSeries = (ids: number[], maxPoints: number, window: SeriesWindow | null) => useQueries({ queries: ids.map((id) => runSeriesQuery(id, maxPoints, window)) });
