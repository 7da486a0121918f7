import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';

export const deletePart = ({ id }: { id: number }) => withUnpublishConfirm((opts) => api.delete<void>(`/api/parts/${id}`, opts));

export function useDeletePart(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deletePart, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
