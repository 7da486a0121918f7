import { useMutation, useQueryClient } from '@tanstack/react-query';
import { CONFIRM_UNPUBLISH_HEADER, type RunDto, type UpdateRunBody } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys, teardownScope } from '@/lib/query-keys';

export const updateRun = ({ run, body, confirmUnpublish }: { run: RunDto; body: UpdateRunBody; confirmUnpublish?: boolean }) =>
  api.patch<{ run: RunDto }>(`/api/runs/${run.id}`, body, confirmUnpublish ? { headers: { [CONFIRM_UNPUBLISH_HEADER]: 'yes' } } : {}).then((r) => r.run);

export function useUpdateRun() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updateRun,
    onSuccess: (run) => Promise.all([qc.invalidateQueries({ queryKey: teardownScope(run.teardownId) }), qc.invalidateQueries({ queryKey: rootKeys.runs })]),
  });
}
