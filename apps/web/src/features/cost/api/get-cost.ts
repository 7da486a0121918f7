import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { CostRollUpDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export interface CostParams {
  volume?: number | undefined;
  currency?: string | undefined;
}

export const costKey = (id: number, p: CostParams) => [...teardownScope(id), 'cost', { volume: p.volume ?? null, currency: p.currency ?? null }] as const;
export const getCost = (id: number, p: CostParams) => api.get<CostRollUpDto>(`/api/teardowns/${id}/cost`, { query: { volume: p.volume, currency: p.currency } });
export const costQuery = (id: number, p: CostParams) =>
  // Keep the last answer on screen while a new volume, currency, price or rate is worked out.
  queryOptions({ queryKey: costKey(id, p), queryFn: () => getCost(id, p), placeholderData: keepPreviousData });
export const useCost = (id: number, p: CostParams) => useQuery(costQuery(id, p));
