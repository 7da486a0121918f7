import { queryOptions, useQuery } from '@tanstack/react-query';
import type { FiguresResponse } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

/** Under teardownScope(id): any change in any section invalidates it, so the panel follows each entry. */
export const figuresKey = (teardownId: number) => [...teardownScope(teardownId), 'figures'] as const;
export const getFigures = (teardownId: number) => api.get<FiguresResponse>(`/api/teardowns/${teardownId}/figures`);
export const figuresQuery = (teardownId: number) => queryOptions({ queryKey: figuresKey(teardownId), queryFn: () => getFigures(teardownId) });
export const useFigures = (teardownId: number) => useQuery(figuresQuery(teardownId));
