import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';

export const deleteMode = ({ teardownId, id }: { teardownId: number; id: number }) => withUnpublishConfirm((opts) => api.delete<void>(`/api/teardowns/${teardownId}/modes/${id}`, opts));

export function useDeleteMode(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteMode, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
