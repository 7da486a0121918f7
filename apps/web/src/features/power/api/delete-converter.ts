import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';

export const deleteConverter = ({ teardownId, id }: { teardownId: number; id: number }) => withUnpublishConfirm((opts) => api.delete<void>(`/api/teardowns/${teardownId}/converters/${id}`, opts));

export function useDeleteConverter(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteConverter, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
