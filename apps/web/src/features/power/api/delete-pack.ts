import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';

export const deletePack = ({ teardownId }: { teardownId: number }) => withUnpublishConfirm((opts) => api.delete<void>(`/api/teardowns/${teardownId}/pack`, opts));

export function useDeletePack(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deletePack, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
