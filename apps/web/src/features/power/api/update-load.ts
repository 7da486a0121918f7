import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LoadDto, UpdateLoadBody } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';

export const updateLoad = ({ teardownId, id, body }: { teardownId: number; id: number; body: UpdateLoadBody }) =>
  withUnpublishConfirm((opts) => api.patch<{ load: LoadDto }>(`/api/teardowns/${teardownId}/loads/${id}`, body, opts)).then((r) => r.load);

export function useUpdateLoad(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateLoad, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
