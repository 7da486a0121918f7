import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const deleteCallout = ({ id, headers }: { id: number; headers?: Record<string, string> }) => api.delete<void>(`/api/callouts/${id}`, { headers });

export function useDeleteCallout(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteCallout, onSettled: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
