import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';

export const deleteLoad = ({ teardownId, id }: { teardownId: number; id: number }) => withUnpublishConfirm((opts) => api.delete<void>(`/api/teardowns/${teardownId}/loads/${id}`, opts));

export function useDeleteLoad(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteLoad, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
