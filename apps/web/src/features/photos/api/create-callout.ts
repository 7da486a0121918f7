import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CalloutDto, CreateCalloutBody } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';

export const createCallout = ({ photoId, body }: { photoId: number; body: CreateCalloutBody }) =>
  withUnpublishConfirm((opts) => api.post<{ callout: CalloutDto }>(`/api/photos/${photoId}/callouts`, body, opts));

export function useCreateCallout(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createCallout, onSettled: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
