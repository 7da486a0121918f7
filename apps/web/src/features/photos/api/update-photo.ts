import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PhotoDto, UpdatePhotoBody } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';

export const updatePhoto = ({ id, body }: { id: number; body: UpdatePhotoBody }) => withUnpublishConfirm((opts) => api.patch<{ photo: PhotoDto }>(`/api/photos/${id}`, body, opts));

export function useUpdatePhoto(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updatePhoto, onSettled: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
