import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ComparisonMetricDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export interface LineupMetrics {
  metrics: ComparisonMetricDto[];
  defaults: Record<string, number>;
  weightMax: number;
}

export const getLineupMetrics = (currency?: string) => api.get<LineupMetrics>('/api/lineups/metrics', { query: { currency } });
export const lineupMetricsQuery = (currency?: string) =>
  queryOptions({ queryKey: [...rootKeys.lineupMetrics, currency ?? ''] as const, queryFn: () => getLineupMetrics(currency), staleTime: 5 * 60_000 });
export const useLineupMetrics = (currency?: string) => useQuery(lineupMetricsQuery(currency));
