import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateLoadBody, LoadDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';

export const createLoad = ({ teardownId, body }: { teardownId: number; body: CreateLoadBody }) =>
  withUnpublishConfirm((opts) => api.post<{ load: LoadDto }>(`/api/teardowns/${teardownId}/loads`, body, opts)).then((r) => r.load);

export function useCreateLoad(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createLoad, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
