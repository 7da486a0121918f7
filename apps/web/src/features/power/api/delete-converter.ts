import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const deleteConverter = ({ teardownId, id, headers }: { teardownId: number; id: number; headers?: Record<string, string> }) =>
  api.delete<void>(`/api/teardowns/${teardownId}/converters/${id}`, { headers });

export function useDeleteConverter(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteConverter, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
