import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CostModelBody, TeardownCostModel } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const teardownCostModelKey = (id: number) => [...teardownScope(id), 'cost-model'] as const;
export const getTeardownCostModel = (id: number) => api.get<TeardownCostModel>(`/api/teardowns/${id}/cost-model`);
export const teardownCostModelQuery = (id: number) => queryOptions({ queryKey: teardownCostModelKey(id), queryFn: () => getTeardownCostModel(id) });
export const useTeardownCostModel = (id: number) => useQuery(teardownCostModelQuery(id));

export function useSaveTeardownCostModel(id: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CostModelBody) => api.put<TeardownCostModel>(`/api/teardowns/${id}/cost-model`, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(id) }),
  });
}

export function useClearTeardownCostModel(id: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.delete<TeardownCostModel>(`/api/teardowns/${id}/cost-model`),
    onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(id) }),
  });
}
