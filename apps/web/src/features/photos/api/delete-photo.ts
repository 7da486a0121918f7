import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';

export const deletePhoto = ({ id }: { id: number }) => withUnpublishConfirm((opts) => api.delete<void>(`/api/photos/${id}`, opts));

export function useDeletePhoto(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deletePhoto, onSettled: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
