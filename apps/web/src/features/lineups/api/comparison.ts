import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { ComparisonDto, LineupMetricKey } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { lineupScope } from './keys';

export interface Axes {
  x?: LineupMetricKey | undefined;
  y?: LineupMetricKey | undefined;
}

/** The comparison with the lineup's saved weights. */
export const getComparison = (id: number, axes: Axes = {}) => api.get<ComparisonDto>(`/api/lineups/${id}/comparison`, { query: { x: axes.x, y: axes.y } });
export const comparisonQuery = (id: number, axes: Axes = {}) =>
  queryOptions({ queryKey: [...lineupScope(id), 'comparison', axes.x ?? '', axes.y ?? ''] as const, queryFn: () => getComparison(id, axes) });
export const useComparison = (id: number, axes: Axes = {}, enabled = true) => useQuery({ ...comparisonQuery(id, axes), placeholderData: keepPreviousData, enabled });
