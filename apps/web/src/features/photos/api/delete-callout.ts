import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';

export const deleteCallout = ({ id }: { id: number }) => withUnpublishConfirm((opts) => api.delete<void>(`/api/callouts/${id}`, opts));

export function useDeleteCallout(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteCallout, onSettled: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
