import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PartDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';
import { partsKey } from './parts';

export const reorderParts = ({ teardownId, ids }: { teardownId: number; ids: number[] }) =>
  withUnpublishConfirm((opts) => api.put<{ parts: PartDto[] }>(`/api/teardowns/${teardownId}/parts/order`, { ids }, opts)).then((r) => r.parts);

export function useReorderParts(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: reorderParts,
    onSuccess: (parts) => {
      qc.setQueryData(partsKey(teardownId), parts);
      return qc.invalidateQueries({ queryKey: teardownScope(teardownId) });
    },
  });
}
