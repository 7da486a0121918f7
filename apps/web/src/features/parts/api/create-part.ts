import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreatePartBody, PartDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';

export const createPart = ({ teardownId, body }: { teardownId: number; body: CreatePartBody }) =>
  withUnpublishConfirm((opts) => api.post<{ part: PartDto }>(`/api/teardowns/${teardownId}/parts`, body, opts)).then((r) => r.part);

export function useCreatePart(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createPart, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
