import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const deletePrice = (partId: number) => api.delete<void>(`/api/parts/${partId}/price`);

export function useDeletePrice(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deletePrice, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
