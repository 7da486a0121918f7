import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ModeDto, UpdateModeBody } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';

export const updateMode = ({ teardownId, id, body }: { teardownId: number; id: number; body: UpdateModeBody }) =>
  withUnpublishConfirm((opts) => api.patch<{ mode: ModeDto }>(`/api/teardowns/${teardownId}/modes/${id}`, body, opts)).then((r) => r.mode);

export function useUpdateMode(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateMode, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
