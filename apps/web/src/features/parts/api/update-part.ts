import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PartDto, UpdatePartBody } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';

export const updatePart = ({ id, body }: { id: number; body: UpdatePartBody }) => withUnpublishConfirm((opts) => api.patch<{ part: PartDto }>(`/api/parts/${id}`, body, opts)).then((r) => r.part);

export function useUpdatePart(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updatePart, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
