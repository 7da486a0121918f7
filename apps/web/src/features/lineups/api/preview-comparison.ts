import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { ComparisonDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import type { Axes } from './comparison';
import { lineupScope } from './keys';

/** The comparison ranked with weights that are not saved (the sliders): the server ranks, the page shows. */
export const previewComparison = (id: number, weights: Record<string, number>, axes: Axes = {}) =>
  api.post<ComparisonDto>(`/api/lineups/${id}/comparison`, { weights, x: axes.x, y: axes.y });
export const previewQuery = (id: number, weights: Record<string, number>, axes: Axes = {}) =>
  queryOptions({
    queryKey: [...lineupScope(id), 'preview', weights, axes.x ?? '', axes.y ?? ''] as const,
    queryFn: () => previewComparison(id, weights, axes),
  });
export const usePreviewComparison = (id: number, weights: Record<string, number> | null, axes: Axes = {}) =>
  useQuery({ ...previewQuery(id, weights ?? {}, axes), enabled: weights !== null, placeholderData: keepPreviousData, retry: false });
