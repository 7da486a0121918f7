import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CostModelBody, CostModelDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

export interface WorkspaceCostModel {
  model: CostModelDto;
  updatedAt: string | null;
  updatedBy: string | null;
}

export const getCostModel = () => api.get<WorkspaceCostModel>('/api/cost-model');
export const costModelQuery = () => queryOptions({ queryKey: rootKeys.costModel, queryFn: getCostModel });
export const useCostModel = () => useQuery(costModelQuery());

export const saveCostModel = (body: CostModelBody) => api.put<WorkspaceCostModel>('/api/cost-model', body);

/** The workspace defaults feed every teardown without its own model: their roll-ups are read again. */
export function useSaveCostModel() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: saveCostModel,
    onSuccess: (data) => {
      qc.setQueryData(rootKeys.costModel, data);
      return qc.invalidateQueries({ queryKey: rootKeys.teardowns });
    },
  });
}
