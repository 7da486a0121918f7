import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RunDto, UpdateRunBody } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys, teardownScope } from '@/lib/query-keys';
import { withUnpublishConfirm } from '@/lib/unpublish-confirm';

/** A change to a run of a published teardown asks first (it moves the teardown back to draft). */
export const updateRun = ({ run, body }: { run: RunDto; body: UpdateRunBody }) => withUnpublishConfirm((opts) => api.patch<{ run: RunDto }>(`/api/runs/${run.id}`, body, opts)).then((r) => r.run);

export function useUpdateRun() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updateRun,
    onSuccess: (run) => Promise.all([qc.invalidateQueries({ queryKey: teardownScope(run.teardownId) }), qc.invalidateQueries({ queryKey: rootKeys.runs })]),
  });
}
