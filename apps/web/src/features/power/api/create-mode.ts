import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateModeBody, ModeDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';

export const createMode = ({ teardownId, body }: { teardownId: number; body: CreateModeBody }) =>
  withUnpublishConfirm((opts) => api.post<{ mode: ModeDto }>(`/api/teardowns/${teardownId}/modes`, body, opts)).then((r) => r.mode);

export function useCreateMode(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createMode, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
