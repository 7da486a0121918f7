import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CalloutDto, PhotosResponse, UpdateCalloutBody } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';
import { photosKey } from './get-photos';

export const updateCallout = ({ id, body }: { id: number; body: UpdateCalloutBody }) => withUnpublishConfirm((opts) => api.patch<{ callout: CalloutDto }>(`/api/callouts/${id}`, body, opts));

/** Moves show at once (optimistic position), and roll back if the server refuses. */
export function useUpdateCallout(teardownId: number) {
  const qc = useQueryClient();
  const key = photosKey(teardownId);
  return useMutation({
    mutationFn: updateCallout,
    onMutate: async ({ id, body }) => {
      await qc.cancelQueries({ queryKey: key });
      const before = qc.getQueryData<PhotosResponse>(key);
      if (before && (body.x !== undefined || body.y !== undefined || body.label !== undefined)) {
        qc.setQueryData<PhotosResponse>(key, {
          ...before,
          photos: before.photos.map((p) => ({
            ...p,
            callouts: p.callouts.map((c) => (c.id === id ? { ...c, x: body.x ?? c.x, y: body.y ?? c.y, label: typeof body.label === 'string' ? body.label.trim() || c.label : c.label } : c)),
          })),
        });
      }
      return { before };
    },
    onError: (_e, _v, context) => {
      if (context?.before) qc.setQueryData(key, context.before);
    },
    onSettled: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }),
  });
}
