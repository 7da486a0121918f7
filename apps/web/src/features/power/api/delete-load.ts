import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const deleteLoad = ({ teardownId, id, headers }: { teardownId: number; id: number; headers?: Record<string, string> }) =>
  api.delete<void>(`/api/teardowns/${teardownId}/loads/${id}`, { headers });

export function useDeleteLoad(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteLoad, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
