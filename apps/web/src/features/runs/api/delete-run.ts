import { useMutation, useQueryClient } from '@tanstack/react-query';
import { CONFIRM_UNPUBLISH_HEADER, type RunDto } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys, teardownScope } from '@/lib/query-keys';

export const deleteRun = ({ run, confirmUnpublish }: { run: RunDto; confirmUnpublish?: boolean }) =>
  api.delete<void>(`/api/runs/${run.id}`, confirmUnpublish ? { headers: { [CONFIRM_UNPUBLISH_HEADER]: 'yes' } } : {});

export function useDeleteRun() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: deleteRun,
    onSuccess: (_void, { run }) => Promise.all([qc.invalidateQueries({ queryKey: teardownScope(run.teardownId) }), qc.invalidateQueries({ queryKey: rootKeys.runs })]),
  });
}
