import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const deletePhoto = ({ id, headers }: { id: number; headers?: Record<string, string> }) => api.delete<void>(`/api/photos/${id}`, { headers });

export function useDeletePhoto(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deletePhoto, onSettled: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
