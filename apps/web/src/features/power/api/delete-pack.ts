import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const deletePack = ({ teardownId, headers }: { teardownId: number; headers?: Record<string, string> }) => api.delete<void>(`/api/teardowns/${teardownId}/pack`, { headers });

export function useDeletePack(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deletePack, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
