import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const deletePart = ({ id, headers }: { id: number; headers?: Record<string, string> }) => api.delete<void>(`/api/parts/${id}`, { headers });

export function useDeletePart(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deletePart, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
