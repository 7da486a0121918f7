import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RunDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys, teardownScope } from '@/lib/query-keys';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';

/** Deleting a run of a published teardown asks first (it moves the teardown back to draft). */
export const deleteRun = ({ run }: { run: RunDto }) => withUnpublishConfirm((opts) => api.delete<void>(`/api/runs/${run.id}`, opts));

export function useDeleteRun() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: deleteRun,
    onSuccess: (_void, { run }) => Promise.all([qc.invalidateQueries({ queryKey: teardownScope(run.teardownId) }), qc.invalidateQueries({ queryKey: rootKeys.runs })]),
  });
}
