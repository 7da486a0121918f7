import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { ComparisonDto, LineupModeChoice } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import type { Axes } from './comparison';
import { lineupScope } from './keys';

/** What a preview tries: weights, and the mode to compare (the saved one when left out). */
export interface PreviewChoice {
  weights: Record<string, number>;
  mode?: LineupModeChoice | undefined;
}

/** The comparison ranked with weights or a mode that are not saved (the sliders, the mode choice): the server ranks, the page shows. */
export const previewComparison = (id: number, choice: PreviewChoice, axes: Axes = {}) =>
  api.post<ComparisonDto>(`/api/lineups/${id}/comparison`, { weights: choice.weights, mode: choice.mode, x: axes.x, y: axes.y });
export const previewQuery = (id: number, choice: PreviewChoice, axes: Axes = {}) =>
  queryOptions({
    queryKey: [...lineupScope(id), 'preview', choice.weights, choice.mode ?? null, axes.x ?? '', axes.y ?? ''] as const,
    queryFn: () => previewComparison(id, choice, axes),
  });
export const usePreviewComparison = (id: number, choice: PreviewChoice | null, axes: Axes = {}) =>
  useQuery({ ...previewQuery(id, choice ?? { weights: {} }, axes), enabled: choice !== null, placeholderData: keepPreviousData, retry: false });
