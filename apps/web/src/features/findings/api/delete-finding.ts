import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';

export const deleteFinding = (teardownId: number, findingId: number) => withUnpublishConfirm((opts) => api.delete<void>(`/api/teardowns/${teardownId}/findings/${findingId}`, opts));

export function useDeleteFinding(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (findingId: number) => deleteFinding(teardownId, findingId), onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
