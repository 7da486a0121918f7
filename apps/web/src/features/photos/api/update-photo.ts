import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PhotoDto, UpdatePhotoBody } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { teardownScope } from '@/lib/query-keys';

export const updatePhoto = ({ id, body, headers }: { id: number; body: UpdatePhotoBody; headers?: Record<string, string> }) =>
  api.patch<{ photo: PhotoDto }>(`/api/photos/${id}`, body, { headers });

export function useUpdatePhoto(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updatePhoto, onSettled: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
