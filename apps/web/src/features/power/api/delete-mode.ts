import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const deleteMode = ({ teardownId, id, headers }: { teardownId: number; id: number; headers?: Record<string, string> }) =>
  api.delete<void>(`/api/teardowns/${teardownId}/modes/${id}`, { headers });

export function useDeleteMode(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteMode, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
