import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PackBody, PackDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';
import { teardownScope } from '@/lib/query-keys';

/** Record or replace the pack (values typed with units; the server stores SI and keeps the text). */
export const savePack = ({ teardownId, body }: { teardownId: number; body: PackBody }) =>
  withUnpublishConfirm((opts) => api.put<{ pack: PackDto }>(`/api/teardowns/${teardownId}/pack`, body, opts)).then((r) => r.pack);

export function useSavePack(teardownId: number) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: savePack, onSuccess: () => qc.invalidateQueries({ queryKey: teardownScope(teardownId) }) });
}
